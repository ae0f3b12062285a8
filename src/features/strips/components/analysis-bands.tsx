import { describeDeltaE } from "../../../../shared/colour";
import type { AnalysisBand, InkSuggestion } from "../../../../shared/schemas/uploads";
import { Badge, type BadgeTone } from "../../../components/ui/badge";
import { ColourSwatch } from "../../../components/ui/colour-swatch";
import { colourWords } from "../../../lib/colour-words";
import { formatHex, formatLab, formatNumber } from "../../../lib/format";
import type { InkColourLookup } from "../ink-choice";
import { directionWords } from "../strip-words";

const confidenceTone: Record<AnalysisBand["confidence"], BadgeTone> = {
  match: "accent",
  close: "neutral",
  "no close ink": "warning",
};

const confidenceNote: Record<AnalysisBand["confidence"], string> = {
  match: "A catalogue ink matches this band.",
  close: "The nearest catalogue inks are close, not exact. Check the suggestion.",
  "no close ink": "No catalogue ink is close. Choose the ink yourself; it may not be in the catalogue yet.",
};

const SHOWN_SUGGESTIONS = 3;

function where(band: AnalysisBand, orientation: "horizontal" | "vertical"): string {
  const from = Math.round(band.start * 100);
  const to = Math.round(band.end * 100);
  return `${from}–${to}% along the strip, ${directionWords(orientation)}`;
}

type SuggestionProps = {
  band: AnalysisBand;
  suggestion: InkSuggestion;
  inkColour: InkColourLookup;
  chosen: boolean;
  onUse: (band: AnalysisBand, suggestion: InkSuggestion) => void;
  disabled: boolean;
};

function Suggestion({ band, suggestion, inkColour, chosen, onUse, disabled }: SuggestionProps) {
  const colour = inkColour(suggestion.inkId);
  return (
    <li className="flex flex-wrap items-center gap-x-3 gap-y-2 py-2" data-testid="suggestion">
      {colour ? (
        <ColourSwatch hex={colour.hex} className="h-9 w-12" />
      ) : (
        <span aria-hidden="true" className="h-9 w-12 shrink-0 rounded-md border border-dashed border-rule-strong" />
      )}
      <div className="min-w-0 flex-1 basis-40">
        <p className="leading-tight font-bold">{suggestion.name}</p>
        <p className="text-sm text-ink-soft">
          {suggestion.brand}
          {colour && (
            <>
              {" · "}
              {colourWords(colour.lab)} · <span className="tabular-nums">{formatHex(colour.hex)}</span>
            </>
          )}
        </p>
        <p className="text-sm text-ink-soft">
          <span className="font-bold text-ink">{describeDeltaE(suggestion.deltaE)}</span>{" "}
          <span className="tabular-nums">(ΔE2000 {formatNumber(suggestion.deltaE)})</span>
        </p>
      </div>
      {chosen ? (
        <span className="text-sm font-bold text-success">
          <span aria-hidden="true">✓ </span>In the ink order
        </span>
      ) : (
        <button
          type="button"
          disabled={disabled}
          onClick={() => onUse(band, suggestion)}
          className="inline-flex min-h-11 items-center rounded-md border border-rule-strong bg-card px-3 text-sm font-bold hover:bg-paper-shade disabled:opacity-60"
        >
          Use for band {band.index + 1}
          <span className="sr-only">: {suggestion.name}</span>
        </button>
      )}
    </li>
  );
}

type AnalysisBandsProps = {
  bands: AnalysisBand[];
  orientation: "horizontal" | "vertical";
  inkColour: InkColourLookup;
  chosenIds: readonly number[];
  onUse: (band: AnalysisBand, suggestion: InkSuggestion) => void;
  disabled?: boolean;
};

/** Each band found: its measured colour in swatch, words and numbers, and the inks it is nearest to. */
export function AnalysisBands({ bands, orientation, inkColour, chosenIds, onUse, disabled = false }: AnalysisBandsProps) {
  const chosen = new Set(chosenIds);
  return (
    <ol className="grid gap-4 md:grid-cols-2" aria-label="Bands found">
      {bands.map((band) => {
        const first = band.suggestions.slice(0, SHOWN_SUGGESTIONS);
        const more = band.suggestions.slice(SHOWN_SUGGESTIONS);
        return (
          <li
            key={band.index}
            className="flex flex-col gap-3 rounded-lg border border-rule bg-card p-4 shadow-card"
            data-testid="analysis-band"
          >
            <div className="flex flex-wrap items-center justify-between gap-2">
              <h3 className="text-lg font-bold">Band {band.index + 1}</h3>
              <Badge tone={confidenceTone[band.confidence]}>{band.confidence}</Badge>
            </div>
            <div className="flex items-center gap-3">
              <ColourSwatch hex={band.hex} className="h-14 w-20" />
              <div className="min-w-0">
                <p className="font-bold">Measured: {colourWords(band.lab)}</p>
                <p className="text-sm text-ink-soft tabular-nums">
                  {formatHex(band.hex)} · {formatLab(band.lab)}
                </p>
                <p className="text-sm text-ink-muted">{where(band, orientation)}</p>
              </div>
            </div>
            <p className="text-sm text-ink-soft">{confidenceNote[band.confidence]}</p>
            {band.suggestions.length > 0 ? (
              <div>
                <h4 className="text-sm font-bold tracking-wide text-ink-muted uppercase">Suggested inks</h4>
                <ol className="divide-y divide-rule">
                  {first.map((s) => (
                    <Suggestion
                      key={s.inkId}
                      band={band}
                      suggestion={s}
                      inkColour={inkColour}
                      chosen={chosen.has(s.inkId)}
                      onUse={onUse}
                      disabled={disabled}
                    />
                  ))}
                </ol>
                {more.length > 0 && (
                  <details className="group">
                    <summary className="inline-flex min-h-11 cursor-pointer items-center font-bold text-accent hover:underline">
                      {more.length} more {more.length === 1 ? "suggestion" : "suggestions"}
                    </summary>
                    <ol className="divide-y divide-rule">
                      {more.map((s) => (
                        <Suggestion
                          key={s.inkId}
                          band={band}
                          suggestion={s}
                          inkColour={inkColour}
                          chosen={chosen.has(s.inkId)}
                          onUse={onUse}
                          disabled={disabled}
                        />
                      ))}
                    </ol>
                  </details>
                )}
              </div>
            ) : (
              <p className="text-ink-soft">No suggestions for this band.</p>
            )}
          </li>
        );
      })}
    </ol>
  );
}
