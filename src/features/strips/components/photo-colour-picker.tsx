import { useEffect, useId, useRef, useState, type ComponentProps, type KeyboardEvent, type MouseEvent, type ReactNode } from "react";
import { hexToLab } from "../../../../shared/colour";
import { Button, ButtonLink } from "../../../components/ui/button";
import { ColourSwatch } from "../../../components/ui/colour-swatch";
import { colourWords } from "../../../lib/colour-words";
import { formatHex } from "../../../lib/format";
import { averageRgba, colourSearchHref, naturalPointFromDrawn, objectFitFrom, rgbToHex, sampleBox, type PixelBox, type Point } from "../sample-colour";
import { PhotoFrame } from "./photo-frame";

type PhotoColourPickerProps = {
  photo: Omit<ComponentProps<typeof PhotoFrame>, "overlay">;
  /** Shown between the photo and the picking controls (a vertical strip's band bar). */
  children?: ReactNode;
};

/** Where on the photo, as fractions of the box drawn on screen (so it survives a resize). */
type Spot = { fx: number; fy: number };
type Picked = { spot: Spot; hex: string } | { spot: Spot; problem: string };

const STEP = 0.01;
const BIG_STEP = 0.05;
const clamp01 = (v: number) => Math.min(1, Math.max(0, v));

/** The file behind the photo at its own pixel size (no srcset, so no density scaling). */
function loadNatural(src: string): Promise<HTMLImageElement> {
  const image = new Image();
  image.decoding = "async";
  image.src = src;
  return image.decode().then(() => image);
}

function readPixels(image: HTMLImageElement, box: PixelBox): Uint8ClampedArray {
  const canvas = document.createElement("canvas");
  canvas.width = box.width;
  canvas.height = box.height;
  const ctx = canvas.getContext("2d", { willReadFrequently: true });
  if (!ctx) throw new Error("no canvas");
  ctx.drawImage(image, box.x, box.y, box.width, box.height, 0, 0, box.width, box.height);
  return ctx.getImageData(0, 0, box.width, box.height).data;
}

/**
 * The strip's photo with a colour picker: "Pick a colour from the photo", then a tap, click or
 * the arrow keys choose a point; the average of the 7×7 pixels of the image file around it is
 * shown as a swatch, words and hex, with a link to search strips with that colour.
 */
export function PhotoColourPicker({ photo, children }: PhotoColourPickerProps) {
  const [picking, setPicking] = useState(false);
  const [picked, setPicked] = useState<Picked | null>(null);
  const frameRef = useRef<HTMLDivElement>(null);
  const surfaceRef = useRef<HTMLDivElement>(null);
  const images = useRef(new Map<string, Promise<HTMLImageElement>>());
  const latest = useRef(0);
  const hintId = useId();
  const toggleId = useId();

  useEffect(() => {
    if (picking) surfaceRef.current?.focus({ preventScroll: true });
  }, [picking]);

  async function sample(spot: Spot) {
    const ticket = ++latest.current;
    const settle = (result: Picked) => {
      if (ticket === latest.current) setPicked(result);
    };
    const shown = frameRef.current?.querySelector("img");
    const surface = surfaceRef.current;
    if (!shown || !surface || !shown.complete || shown.naturalWidth === 0) {
      settle({ spot, problem: "The photo has not loaded yet. Try again in a moment." });
      return;
    }
    try {
      const src = shown.currentSrc || shown.src;
      let loading = images.current.get(src);
      if (!loading) {
        loading = loadNatural(src);
        images.current.set(src, loading);
        loading.catch(() => images.current.delete(src));
      }
      const image = await loading;
      const rect = surface.getBoundingClientRect();
      const natural = { width: image.naturalWidth, height: image.naturalHeight };
      const drawnAt: Point = { x: spot.fx * rect.width, y: spot.fy * rect.height };
      const at = naturalPointFromDrawn(drawnAt, rect, natural, { fit: objectFitFrom(getComputedStyle(shown).objectFit) });
      if (!at) {
        settle({ spot, problem: "That point is outside the photo." });
        return;
      }
      const rgb = averageRgba(readPixels(image, sampleBox(at, natural)));
      settle(rgb ? { spot, hex: rgbToHex(rgb) } : { spot, problem: "That point of the photo is see-through." });
    } catch {
      settle({ spot, problem: "The colours of this photo could not be read here. Try the band links below the photo." });
    }
  }

  function onSurfaceClick(e: MouseEvent<HTMLDivElement>) {
    const rect = e.currentTarget.getBoundingClientRect();
    if (rect.width === 0 || rect.height === 0) return;
    void sample({ fx: clamp01((e.clientX - rect.left) / rect.width), fy: clamp01((e.clientY - rect.top) / rect.height) });
  }

  function onSurfaceKeyDown(e: KeyboardEvent<HTMLDivElement>) {
    const from = picked?.spot ?? { fx: 0.5, fy: 0.5 };
    const step = e.shiftKey ? BIG_STEP : STEP;
    const moves: Record<string, Spot> = {
      ArrowLeft: { fx: from.fx - step, fy: from.fy },
      ArrowRight: { fx: from.fx + step, fy: from.fy },
      ArrowUp: { fx: from.fx, fy: from.fy - step },
      ArrowDown: { fx: from.fx, fy: from.fy + step },
      Enter: from,
      " ": from,
    };
    if (e.key === "Escape") {
      e.preventDefault();
      setPicking(false);
      document.getElementById(toggleId)?.focus();
      return;
    }
    const to = moves[e.key];
    if (!to) return;
    e.preventDefault();
    void sample({ fx: clamp01(to.fx), fy: clamp01(to.fy) });
  }

  const spot = picked?.spot;
  const markerFill = picked && "hex" in picked ? picked.hex : "transparent";
  const overlay = (
    <>
      {picking && (
        <div
          ref={surfaceRef}
          role="application"
          tabIndex={0}
          aria-label="Photo colour picker"
          aria-describedby={hintId}
          onClick={onSurfaceClick}
          onKeyDown={onSurfaceKeyDown}
          className="absolute inset-0 cursor-crosshair touch-manipulation rounded-md outline-offset-2 focus-visible:outline-3 focus-visible:outline-accent"
        />
      )}
      {spot && (
        <span
          aria-hidden="true"
          className="pointer-events-none absolute h-7 w-7 -translate-x-1/2 -translate-y-1/2 rounded-full border-2 border-white shadow-[0_0_0_2px_rgb(0_0_0/0.75)]"
          style={{ left: `${spot.fx * 100}%`, top: `${spot.fy * 100}%`, backgroundColor: markerFill }}
        />
      )}
    </>
  );

  return (
    <>
      <div ref={frameRef}>
        <PhotoFrame {...photo} overlay={overlay} />
      </div>
      {children}
      <div className="flex flex-col gap-3">
        <div className="flex flex-wrap items-center gap-x-4 gap-y-2">
          <Button id={toggleId} variant="secondary" onClick={() => setPicking((on) => !on)}>
            <svg aria-hidden="true" viewBox="0 0 20 20" className="h-5 w-5" fill="none" stroke="currentColor" strokeWidth="2">
              <circle cx="10" cy="10" r="6" />
              <path d="M10 1v5M10 14v5M1 10h5M14 10h5" strokeLinecap="round" />
            </svg>
            {picking ? "Done picking" : "Pick a colour from the photo"}
          </Button>
          {picking && (
            <p id={hintId} className="text-sm text-ink-soft">
              Tap or click a point on the photo. With a keyboard, the arrow keys move the point (Shift for bigger steps);
              Escape stops.
            </p>
          )}
        </div>
        <div aria-live="polite" aria-atomic="true">
          {picked && "problem" in picked && <p className="text-danger">{picked.problem}</p>}
          {picked && "hex" in picked && <PickedColour hex={picked.hex} />}
        </div>
        {picked && "hex" in picked && (
          <p className="max-w-prose text-sm text-ink-muted">
            The average of a 7 × 7 pixel square of the photo at that point. The band colours below are measured over
            each whole band, so one point can differ a little from them.
          </p>
        )}
      </div>
    </>
  );
}

function PickedColour({ hex }: { hex: string }) {
  return (
    <div className="flex flex-col gap-3 rounded-lg border border-rule bg-paper p-3 sm:flex-row sm:items-center sm:gap-4" data-testid="picked-colour">
      <div className="flex flex-1 items-center gap-3">
        <ColourSwatch hex={hex} className="h-12 w-16" />
        <p className="leading-snug">
          <span className="block text-sm text-ink-muted">Picked from the photo</span>
          <span className="block font-bold">{colourWords(hexToLab(hex))}</span>
          <span className="block text-sm text-ink-soft tabular-nums">{formatHex(hex)}</span>
        </p>
      </div>
      <ButtonLink to={colourSearchHref(hex)} variant="primary" className="self-start sm:self-auto">
        Find strips with this colour
      </ButtonLink>
    </div>
  );
}
