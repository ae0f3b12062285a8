import type { Lab } from "../../../../shared/colour";
import { directionWords } from "../strip-words";

export type BarBand = { index: number; start: number; end: number; hex: string; lab: Lab };

const pct = (f: number) => `${(Math.min(1, Math.max(0, f)) * 100).toFixed(2)}%`;

/** The bands' measured colours at their places along the strip; the gaps blend like the strip does. */
function barGradient(bands: BarBand[]): string {
  const sorted = [...bands].sort((a, b) => a.start - b.start);
  if (sorted.length === 0) return "none";
  if (sorted.length === 1) return `linear-gradient(${sorted[0]!.hex}, ${sorted[0]!.hex})`;
  const stops = sorted.flatMap((b) => [`${b.hex} ${pct(b.start)}`, `${b.hex} ${pct(b.end)}`]);
  return `linear-gradient(90deg, ${stops.join(", ")})`;
}

type BandBarProps = {
  bands: BarBand[];
  orientation: "horizontal" | "vertical";
  /** The caption's first words, e.g. "Bands found". */
  title?: string;
  className?: string;
  /** Bands to pick out (e.g. the ones that answered a colour search); the rest are drawn lighter. */
  highlight?: readonly number[];
};

/**
 * The bands drawn as one bar under the photo, each outlined and numbered at its start and end
 * along the strip. Vertical strips are laid left to right too, and the caption says so.
 */
export function BandBar({ bands, orientation, title = "Bands along the strip", className = "", highlight }: BandBarProps) {
  const caption =
    orientation === "vertical"
      ? `${title}, top to bottom (drawn here left to right)`
      : `${title}, ${directionWords(orientation)}`;
  return (
    <figure className={`flex flex-col gap-1.5 ${className}`} data-testid="band-bar">
      <div className="relative h-12 rounded-md border border-rule-strong" style={{ backgroundImage: barGradient(bands), backgroundColor: "#fff" }}>
        {bands.map((band) => {
          const picked = highlight?.includes(band.index);
          const faded = highlight && !picked;
          return (
          <div
            key={band.index}
            data-highlighted={picked || undefined}
            className={`absolute rounded-sm shadow-[inset_0_0_0_1px_rgb(255_255_255/0.8)] ${
              picked
                ? "-inset-y-1 z-10 border-4 border-ink ring-2 ring-card"
                : `inset-y-0 ${faded ? "border border-ink/30" : "border-2 border-ink/70"}`
            }`}
            style={{ left: pct(band.start), width: `calc(${pct(band.end - band.start)})` }}
          >
            <span className="absolute top-1/2 left-1/2 grid h-6 min-w-6 -translate-x-1/2 -translate-y-1/2 place-items-center rounded-full border border-ink/40 bg-card px-1 text-sm font-bold tabular-nums">
              <span className="sr-only">Band </span>
              {band.index + 1}
            </span>
          </div>
          );
        })}
      </div>
      <figcaption className="flex justify-between gap-3 text-sm text-ink-muted">
        <span>{caption}</span>
        <span aria-hidden="true">{orientation === "vertical" ? "top → bottom" : "left → right"}</span>
      </figcaption>
    </figure>
  );
}
