import type { Analysis, AnalysisBand, InkSuggestion } from "../../../../shared/schemas/uploads";
import { Notice } from "../../../components/ui/notice";
import { plural } from "../../../lib/format";
import type { InkColourLookup } from "../ink-choice";
import { directionWords } from "../strip-words";
import { AnalysisBands } from "./analysis-bands";

type PostBandsSectionProps = {
  analysis: Pick<Analysis, "bands" | "orientation">;
  /** The photo was measured again after the member changed the ink order. */
  remeasured: boolean;
  inkColour: InkColourLookup;
  chosenIds: number[];
  onUse: (band: AnalysisBand, s: InkSuggestion) => void;
  disabled: boolean;
};

/** The bands found, each with its measured colour and the nearest catalogue inks. */
export function PostBandsSection({ analysis, remeasured, inkColour, chosenIds, onUse, disabled }: PostBandsSectionProps) {
  return (
      <section aria-labelledby="bands-title" className="flex flex-col gap-4">
        <div className="space-y-1">
          <h2 id="bands-title" className="text-2xl font-bold">
            Bands found
          </h2>
          <p className="text-ink-soft">
            We found {plural(analysis.bands.length, "band")}, {directionWords(analysis.orientation)}. Each shows its
            measured colour and the catalogue inks nearest to it (ΔE2000: the smaller, the closer).
          </p>
        </div>
        {remeasured && (
          <Notice tone="info" title="The bands were measured again">
            <p>Your ink order is kept as you left it. Check it against the new suggestions below.</p>
          </Notice>
        )}
        <AnalysisBands
          bands={analysis.bands}
          orientation={analysis.orientation}
          inkColour={inkColour}
          chosenIds={chosenIds}
          onUse={onUse}
          disabled={disabled}
        />
      </section>
  );
}
