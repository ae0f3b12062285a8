import type { ReviewQueueItem } from "../../../../shared/schemas/moderation";
import { ColourSwatch } from "../../../components/ui/colour-swatch";
import { colourWords } from "../../../lib/colour-words";
import { formatHex, formatNumber } from "../../../lib/format";
import { deltaEText, spanWords } from "../review-words";

/** The ink order as posted, numbered, each ink with its colour in words and hex. */
export function InkOrderList({ inks }: { inks: ReviewQueueItem["strip"]["inks"] }) {
  if (inks.length === 0) return <p className="text-ink-muted">No inks named.</p>;
  return (
    <ol className="flex flex-col gap-1.5">
      {inks.map((ink, i) => (
        <li key={ink.id} className="flex items-center gap-2">
          <span className="w-5 shrink-0 text-right font-bold tabular-nums text-ink-muted">{i + 1}.</span>
          <ColourSwatch hex={ink.hex} className="h-6 w-8" />
          <span className="min-w-0 leading-tight">
            <span className="font-bold">{ink.name}</span> <span className="text-ink-soft">· {ink.brand}</span>
            <span className="block text-sm text-ink-muted">
              {colourWords(ink.lab)} · <span className="tabular-nums">{formatHex(ink.hex)}</span>
            </span>
          </span>
        </li>
      ))}
    </ol>
  );
}

/**
 * Each band found in the photo: where it is, its measured colour, the tagged ink nearest to it,
 * and the catalogue's best matches. A tagged ink far from its band gets a warning in words.
 */
export function BandChecks({ item }: { item: ReviewQueueItem }) {
  const { strip, farBands, suggestions } = item;
  if (strip.bands.length === 0) return <p className="text-ink-muted">No bands were measured for this strip.</p>;
  return (
    <ol className="flex flex-col gap-2">
      {strip.bands.map((band) => {
        const tagged = strip.inks.find((i) => i.id === band.inkId);
        const far = farBands.includes(band.index);
        const suggested = suggestions.find((s) => s.bandIndex === band.index)?.inks ?? [];
        return (
          <li
            key={band.index}
            className={`rounded-md border p-2.5 ${far ? "border-danger/50 bg-danger-soft/50" : "border-rule bg-paper/60"}`}
          >
            <div className="flex flex-wrap items-center gap-x-2 gap-y-1">
              <span className="font-bold">Band {band.index + 1}</span>
              <ColourSwatch hex={band.hex} className="h-5 w-7" />
              <span className="text-ink-soft">
                measured {colourWords(band.lab)} <span className="tabular-nums">{formatHex(band.hex)}</span>
              </span>
              <span className="text-sm text-ink-muted">({spanWords(band.start, band.end)})</span>
            </div>
            {far && (
              <p className="mt-1 flex items-start gap-1.5 font-bold text-danger">
                <span aria-hidden="true">!</span>
                <span>
                  Tagged ink is far from this band
                  {band.deltaE !== null ? `: ${deltaEText(band.deltaE)}` : ""}.
                </span>
              </p>
            )}
            <dl className="mt-1 grid gap-x-3 gap-y-0.5 text-sm sm:grid-cols-[auto_1fr]">
              <dt className="text-ink-muted">Tagged ink</dt>
              <dd>
                {tagged ? (
                  <>
                    <span className="font-bold">{tagged.name}</span> · {tagged.brand}
                    {band.deltaE !== null && <span className="text-ink-soft"> — {deltaEText(band.deltaE)}</span>}
                  </>
                ) : (
                  <span className="text-ink-muted">none of the tagged inks</span>
                )}
              </dd>
              <dt className="text-ink-muted">Suggested</dt>
              <dd>
                {suggested.length === 0 ? (
                  <span className="text-ink-muted">no suggestions</span>
                ) : (
                  <ul className="flex flex-wrap gap-x-3 gap-y-0.5">
                    {suggested.map((s) => (
                      <li key={s.inkId}>
                        <span className={tagged?.id === s.inkId ? "font-bold" : ""}>{s.name}</span>{" "}
                        <span className="text-ink-muted">
                          ({s.brand}, ΔE <span className="tabular-nums">{formatNumber(s.deltaE)}</span>)
                        </span>
                        {tagged?.id === s.inkId && <span className="sr-only"> (the tagged ink)</span>}
                      </li>
                    ))}
                  </ul>
                )}
              </dd>
            </dl>
          </li>
        );
      })}
    </ol>
  );
}
