import type { StripBand } from "../../../../shared/schemas/strips";

const pct = (f: number) => `${(Math.min(1, Math.max(0, f)) * 100).toFixed(2)}%`;

/** The measured colours at their places along the strip; the gaps between bands blend. */
export function bandGradient(bands: Pick<StripBand, "start" | "end" | "hex">[]): string {
  const sorted = [...bands].sort((a, b) => a.start - b.start);
  if (sorted.length === 0) return "none";
  // backgroundImage needs an image: one band is a gradient from its colour to itself.
  if (sorted.length === 1) return `linear-gradient(${sorted[0].hex}, ${sorted[0].hex})`;
  return `linear-gradient(90deg, ${sorted.flatMap((b) => [`${b.hex} ${pct(b.start)}`, `${b.hex} ${pct(b.end)}`]).join(", ")})`;
}

type QueueBandBarProps = {
  bands: StripBand[];
  orientation: "horizontal" | "vertical";
  /** Band indexes to mark as a problem (tagged ink far from the band). */
  flagged?: readonly number[];
};

/**
 * The bands as one bar under the photo, numbered, with flagged bands marked by a "!" as well as
 * a heavier outline (so the mark does not depend on colour). Decorative for screen readers: the
 * band list beside it gives the same facts in words.
 */
export function QueueBandBar({ bands, orientation, flagged = [] }: QueueBandBarProps) {
  return (
    <figure className="flex flex-col gap-1">
      <div
        aria-hidden="true"
        className="relative h-9 rounded-md border border-rule-strong bg-white"
        style={{ backgroundImage: bandGradient(bands) }}
      >
        {bands.map((band) => {
          const far = flagged.includes(band.index);
          return (
            <div
              key={band.index}
              className={`absolute inset-y-0 rounded-sm ${far ? "border-[3px] border-dashed border-danger" : "border-2 border-ink/60"}`}
              style={{ left: pct(band.start), width: pct(band.end - band.start) }}
            >
              <span
                className={`absolute top-1/2 left-1/2 grid h-6 min-w-6 -translate-x-1/2 -translate-y-1/2 place-items-center rounded-full border px-1 text-sm font-bold tabular-nums ${
                  far ? "border-danger bg-danger text-card" : "border-ink/40 bg-card text-ink"
                }`}
              >
                {band.index + 1}
                {far && "!"}
              </span>
            </div>
          );
        })}
      </div>
      <figcaption className="text-sm text-ink-muted">
        {bands.length === 0
          ? "No bands were found in this photo."
          : `${bands.length} ${bands.length === 1 ? "band" : "bands"} found, ${orientation === "vertical" ? "top to bottom (drawn here left to right)" : "left to right"}.`}
      </figcaption>
    </figure>
  );
}
