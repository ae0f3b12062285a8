import { useRef, useState, type KeyboardEvent, type PointerEvent } from "react";
import type { Outline, UploadImages } from "../../../../shared/schemas/uploads";
import { uprightSrcSet } from "../image-sources";
import { centreOf, CORNER_BIG_STEP, CORNER_STEP, cornerNames, withCorner, type Corner } from "../outline-editing";
import { placeholderAspect } from "../placeholder";
import { PhotoFrame } from "./photo-frame";

type StripOutlinesEditorProps = {
  images: UploadImages;
  alt: string;
  /** Every strip's outline as shown now (the member's drags included), in reading order. */
  outlines: Outline[];
  selected: number;
  onSelect: (index: number) => void;
  /** A corner of the selected strip moved (while dragging, or by a key press). */
  onMove: (index: number, outline: Outline) => void;
  /** The member let go of a corner (pointer up, or a pause after arrow keys): time to read the strip again. */
  onRelease: (index: number, outline: Outline) => void;
  /** Strips whose outline cannot be read as it is (drawn dashed). */
  troubled?: number[];
  /** Posted strips: drawn, numbered, but without handles. */
  locked?: number[];
  busy?: boolean;
};

const INK = "#1c2130";
const CARD = "#fffefb";
const ACCENT = "#21546a";
/** After the last arrow key press, wait this long before reading the strip again (ms). */
const KEY_SETTLE_MS = 700;

/**
 * The photo with every strip's outline drawn and numbered (reading order), and the selected
 * strip's four corners as handles: drag them by touch or mouse (pointer events), or focus one
 * and move it with the arrow keys (Shift for bigger steps). Tapping inside an outline selects it.
 */
export function StripOutlinesEditor({ images, alt, outlines, selected, onSelect, onMove, onRelease, troubled = [], locked = [], busy = false }: StripOutlinesEditorProps) {
  const area = useRef<HTMLDivElement>(null);
  const dragging = useRef<{ corner: Corner; pointer: number } | null>(null);
  const keyTimer = useRef<number | undefined>(undefined);
  const [size, setSize] = useState<{ width: number; height: number } | null>(null);
  const aspect = size ? size.width / size.height : (placeholderAspect(images.placeholder) ?? 1.5);
  // Drawing units: the photo's own pixels once known; the shape is what matters.
  const w = size?.width ?? 1000;
  const h = size?.height ?? Math.round(1000 / aspect);
  const line = Math.max(2, Math.max(w, h) / 350);
  const label = Math.max(16, Math.max(w, h) / 28);
  const current = locked.includes(selected) ? undefined : outlines[selected];

  function pointAt(e: PointerEvent<HTMLElement>): [number, number] | null {
    const rect = area.current?.getBoundingClientRect();
    if (!rect || rect.width === 0 || rect.height === 0) return null;
    return [(e.clientX - rect.left) / rect.width, (e.clientY - rect.top) / rect.height];
  }

  function down(corner: Corner, e: PointerEvent<HTMLButtonElement>) {
    if (busy) return;
    e.preventDefault();
    e.currentTarget.focus();
    e.currentTarget.setPointerCapture(e.pointerId);
    dragging.current = { corner, pointer: e.pointerId };
  }

  function move(e: PointerEvent<HTMLButtonElement>) {
    const drag = dragging.current;
    if (!drag || drag.pointer !== e.pointerId || !current) return;
    const p = pointAt(e);
    if (p) onMove(selected, withCorner(current, drag.corner, p[0], p[1]));
  }

  function up(e: PointerEvent<HTMLButtonElement>) {
    const drag = dragging.current;
    if (!drag || drag.pointer !== e.pointerId || !current) return;
    dragging.current = null;
    const p = pointAt(e);
    onRelease(selected, p ? withCorner(current, drag.corner, p[0], p[1]) : current);
  }

  function key(corner: Corner, e: KeyboardEvent<HTMLButtonElement>) {
    const step = e.shiftKey ? CORNER_BIG_STEP : CORNER_STEP;
    const moves: Record<string, [number, number]> = { ArrowLeft: [-step, 0], ArrowRight: [step, 0], ArrowUp: [0, -step], ArrowDown: [0, step] };
    const m = moves[e.key];
    if (!m || !current || busy) return;
    e.preventDefault();
    const next = withCorner(current, corner, current[corner][0] + m[0], current[corner][1] + m[1]);
    onMove(selected, next);
    window.clearTimeout(keyTimer.current);
    keyTimer.current = window.setTimeout(() => onRelease(selected, next), KEY_SETTLE_MS);
  }

  const overlay = (
    <div ref={area} className="absolute inset-0" data-testid="strip-outlines">
      <svg viewBox={`0 0 ${w} ${h}`} preserveAspectRatio="none" aria-hidden="true" className="pointer-events-none absolute inset-0 h-full w-full">
        {outlines.map((outline, i) => {
          const points = outline.map(([x, y]) => `${x * w},${y * h}`).join(" ");
          const [cx, cy] = centreOf(outline);
          const isSelected = i === selected;
          const dashed = troubled.includes(i) ? `${line * 3} ${line * 2}` : undefined;
          return (
            <g key={i} data-testid="strip-outline" data-strip={i + 1}>
              <polygon points={points} fill="transparent" stroke={CARD} strokeWidth={line * 3} strokeLinejoin="round" />
              <polygon
                points={points}
                fill={isSelected ? "rgba(33, 84, 106, 0.12)" : "transparent"}
                stroke={isSelected ? ACCENT : INK}
                strokeWidth={isSelected ? line * 1.6 : line}
                strokeDasharray={dashed}
                strokeLinejoin="round"
                style={{ pointerEvents: "visibleFill", cursor: "pointer" }}
                onClick={() => onSelect(i)}
              />
              <circle cx={cx * w} cy={cy * h} r={label * 0.8} fill={isSelected ? ACCENT : CARD} stroke={INK} strokeWidth={line / 1.5} />
              <text x={cx * w} y={cy * h} textAnchor="middle" dominantBaseline="central" fontSize={label} fontWeight={700} fill={isSelected ? CARD : INK}>
                {i + 1}
              </text>
            </g>
          );
        })}
      </svg>
      {current &&
        current.map(([x, y], k) => (
          <button
            key={k}
            type="button"
            className="absolute flex h-12 w-12 -translate-x-1/2 -translate-y-1/2 touch-none items-center justify-center rounded-full outline-offset-2 focus-visible:outline-3 focus-visible:outline-accent"
            style={{ left: `${x * 100}%`, top: `${y * 100}%`, cursor: busy ? "wait" : "grab" }}
            aria-label={`Strip ${selected + 1}, corner ${k + 1} (${cornerNames[k]}), at ${Math.round(x * 100)}% across and ${Math.round(y * 100)}% down. Arrow keys move it; hold Shift to move it further.`}
            aria-disabled={busy || undefined}
            data-testid="outline-corner"
            onPointerDown={(e) => down(k as Corner, e)}
            onPointerMove={move}
            onPointerUp={up}
            onPointerCancel={up}
            onKeyDown={(e) => key(k as Corner, e)}
          >
            <span aria-hidden="true" className="h-5 w-5 rounded-full border-[3px] border-card bg-accent shadow-[0_0_0_2px_#1c2130]" />
          </button>
        ))}
    </div>
  );

  return (
    <div className={busy ? "opacity-80 transition-opacity" : "transition-opacity"}>
      <PhotoFrame
        src={images.display}
        srcSet={uprightSrcSet(images, aspect)}
        sizes="(min-width: 66rem) 62rem, calc(100vw - 2rem)"
        alt={alt}
        placeholder={images.placeholder}
        maxHeight="70vh"
        overlay={overlay}
        onLoad={setSize}
      />
    </div>
  );
}
