import { useState, type KeyboardEvent, type MouseEvent } from "react";
import type { Upload } from "../../../../shared/schemas/uploads";
import { uprightSrcSet } from "../image-sources";
import { placeholderAspect } from "../placeholder";
import { stripGeometry } from "../strip-geometry";
import { BandBar } from "./band-bar";
import { BandOutlines } from "./band-outlines";
import { PhotoFrame } from "./photo-frame";

export type WhitePoint = { x: number; y: number };

type AnalysedPhotoProps = {
  /** The last upload that came back "ready" (its photo and bands). */
  upload: Upload & { analysis: NonNullable<Upload["analysis"]>; images: NonNullable<Upload["images"]> };
  alt: string;
  /** The white point last sent, drawn as a marker. */
  white: WhitePoint | null;
  onSetWhite: (point: WhitePoint) => void;
  /** While analysing again, taps wait. */
  busy?: boolean;
};

const STEP = 0.02;
const clamp = (v: number) => Math.min(1, Math.max(0, v));
const round = (v: number) => Math.round(v * 10_000) / 10_000;

/**
 * The analysed photo with its bands (outlined on the photo when the analysis says where the strip
 * lies, else as a bar under it). Tapping the photo sets the paper white; from the keyboard, the
 * arrow keys move a cross-hair and Enter sets it.
 */
export function AnalysedPhoto({ upload, alt, white, onSetWhite, busy = false }: AnalysedPhotoProps) {
  const { analysis, images } = upload;
  const geometry = stripGeometry(analysis);
  const [size, setSize] = useState<{ width: number; height: number } | null>(null);
  const [cursor, setCursor] = useState<WhitePoint>({ x: 0.06, y: 0.08 });
  const [keyboard, setKeyboard] = useState(false);

  function pointFromEvent(e: MouseEvent<HTMLButtonElement>): WhitePoint {
    const rect = e.currentTarget.getBoundingClientRect();
    return { x: round(clamp((e.clientX - rect.left) / rect.width)), y: round(clamp((e.clientY - rect.top) / rect.height)) };
  }

  function onClick(e: MouseEvent<HTMLButtonElement>) {
    if (busy) return;
    // detail 0: Enter or Space, not a pointer.
    const point = e.detail === 0 ? { x: round(cursor.x), y: round(cursor.y) } : pointFromEvent(e);
    if (e.detail !== 0) setKeyboard(false);
    onSetWhite(point);
  }

  function onKeyDown(e: KeyboardEvent<HTMLButtonElement>) {
    const step = e.shiftKey ? STEP * 5 : STEP;
    const moves: Record<string, [number, number]> = {
      ArrowLeft: [-step, 0],
      ArrowRight: [step, 0],
      ArrowUp: [0, -step],
      ArrowDown: [0, step],
    };
    const m = moves[e.key];
    if (!m) return;
    e.preventDefault();
    setKeyboard(true);
    setCursor((c) => ({ x: clamp(c.x + m[0]), y: clamp(c.y + m[1]) }));
  }

  const overlay = (
    <>
      {geometry && size && <BandOutlines geometry={geometry} bands={analysis.bands} width={size.width} height={size.height} />}
      {white && (
        <span
          aria-hidden="true"
          className="pointer-events-none absolute h-6 w-6 -translate-x-1/2 -translate-y-1/2 rounded-full border-[3px] border-ink shadow-[0_0_0_2px_#fffefb]"
          style={{ left: `${white.x * 100}%`, top: `${white.y * 100}%` }}
          data-testid="white-marker"
        />
      )}
      <button
        type="button"
        onClick={onClick}
        onKeyDown={onKeyDown}
        onBlur={() => setKeyboard(false)}
        aria-disabled={busy || undefined}
        aria-describedby="white-point-help"
        className={`peer absolute inset-0 rounded-md ${busy ? "cursor-wait" : "cursor-crosshair"}`}
        data-testid="white-point-target"
      >
        <span className="sr-only">
          Set the paper white: tap a clean patch of white paper beside the strip. With a keyboard, move the cross-hair
          with the arrow keys and press Enter.
        </span>
      </button>
      {keyboard && (
        <span
          aria-hidden="true"
          className="pointer-events-none absolute h-10 w-10 -translate-x-1/2 -translate-y-1/2"
          style={{ left: `${cursor.x * 100}%`, top: `${cursor.y * 100}%` }}
        >
          <span className="absolute top-1/2 left-0 h-0.5 w-full -translate-y-1/2 bg-ink shadow-[0_0_0_1px_#fffefb]" />
          <span className="absolute top-0 left-1/2 h-full w-0.5 -translate-x-1/2 bg-ink shadow-[0_0_0_1px_#fffefb]" />
        </span>
      )}
    </>
  );

  const bar = <BandBar bands={analysis.bands} orientation={analysis.orientation} title="Bands found" />;

  return (
    <div className="flex flex-col gap-3">
      <div className={busy ? "opacity-60 transition-opacity" : "transition-opacity"}>
        <PhotoFrame
          src={images.display}
          srcSet={uprightSrcSet(images, size ? size.width / size.height : (placeholderAspect(images.placeholder) ?? 1.5))}
          sizes="(min-width: 66rem) 62rem, calc(100vw - 2rem)"
          alt={alt}
          placeholder={images.placeholder}
          maxHeight="65vh"
          overlay={overlay}
          onLoad={setSize}
          footer={!geometry && analysis.orientation === "horizontal" && bar}
        />
      </div>
      {!geometry && analysis.orientation === "vertical" && bar}
    </div>
  );
}
