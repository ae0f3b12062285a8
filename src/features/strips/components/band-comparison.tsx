import { describeDeltaE } from "../../../../shared/colour";
import type { Strip } from "../../../../shared/schemas/strips";
import { ColourSwatch } from "../../../components/ui/colour-swatch";
import { colourWords } from "../../../lib/colour-words";
import { formatHex, formatNumber } from "../../../lib/format";
import { directionWords } from "../strip-words";

/**
 * Each band's colour as measured on the photo beside the reference colour of the ink it was
 * tagged with, and how far apart they are (ΔE2000) in words and as a number.
 */
export function BandComparison({ strip }: { strip: Pick<Strip, "bands" | "inks" | "orientation"> }) {
  const inks = new Map(strip.inks.map((i) => [i.id, i]));
  return (
    <ol className="flex flex-col gap-3" aria-label={`Bands, ${directionWords(strip.orientation)}`}>
      {strip.bands.map((band) => {
        const ink = band.inkId !== null ? inks.get(band.inkId) : undefined;
        return (
          <li key={band.index} className="rounded-lg border border-rule bg-card p-3 shadow-card sm:p-4" data-testid="band-comparison">
            <h3 className="mb-2 font-bold">Band {band.index + 1}</h3>
            <div className="grid gap-3 sm:grid-cols-[1fr_1fr_auto] sm:items-center">
              <div className="flex items-center gap-3">
                <ColourSwatch hex={band.hex} className="h-12 w-16" />
                <p className="leading-snug">
                  <span className="block text-sm text-ink-muted">Measured on the photo</span>
                  <span className="block font-bold">{colourWords(band.lab)}</span>
                  <span className="block text-sm text-ink-soft tabular-nums">{formatHex(band.hex)}</span>
                </p>
              </div>
              {ink ? (
                <div className="flex items-center gap-3">
                  <ColourSwatch hex={ink.hex} className="h-12 w-16" />
                  <p className="leading-snug">
                    <span className="block text-sm text-ink-muted">Ink reference</span>
                    <span className="block font-bold">{ink.name}</span>
                    <span className="block text-sm text-ink-soft">
                      {ink.brand} · {colourWords(ink.lab)} · <span className="tabular-nums">{formatHex(ink.hex)}</span>
                    </span>
                  </p>
                </div>
              ) : (
                <p className="text-ink-soft">No ink of this strip is tagged to this band.</p>
              )}
              {band.deltaE !== null && (
                <p className="rounded-md bg-paper-shade px-3 py-2 text-center sm:min-w-36">
                  <span className="block font-bold">{describeDeltaE(band.deltaE)}</span>
                  <span className="block text-sm text-ink-soft tabular-nums">ΔE2000 {formatNumber(band.deltaE)}</span>
                </p>
              )}
            </div>
          </li>
        );
      })}
    </ol>
  );
}
