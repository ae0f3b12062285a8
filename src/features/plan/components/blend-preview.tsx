import { useMemo } from "react";
import type { Ink } from "../../../../shared/schemas/inks";
import { joinFacts, STEP_SCALE } from "../../../../shared/colour/joins";
import { BlendStrip } from "./blend-strip";
import { JoinHints } from "./join-hints";

type BlendPreviewProps = {
  inks: Ink[];
  /** The bridge finder's address for a join, if it should be offered. */
  bridgeHref?: (first: Ink, second: Ink) => string;
};

/** The planned strip, then what to expect at each join. */
export function BlendPreview({ inks, bridgeHref }: BlendPreviewProps) {
  const labs = useMemo(() => inks.map((i) => i.lab), [inks]);
  const joins = useMemo(() => inks.slice(1).map((ink, i) => joinFacts(inks[i]!.lab, ink.lab)), [inks]);
  const muddy = joins.filter((j) => j.muddy).length;
  const takeovers = joins.filter((j) => j.takeover).length;
  return (
    <div className="flex flex-col gap-4">
      <BlendStrip labs={labs} label={`Blend preview: ${inks.map((i) => i.name).join(", then ")}`} />
      <ol className="grid grid-cols-1 gap-1 text-sm sm:flex sm:justify-between" aria-label="Inks along the strip">
        {inks.map((ink, i) => (
          <li key={`${ink.id}-${i}`} className="sm:max-w-40 sm:text-center">
            <span className="font-bold">{i + 1}.</span> {ink.name} <span className="text-ink-muted">({ink.brand.name})</span>
          </li>
        ))}
      </ol>
      <p role="status" className="text-ink-soft" data-testid="plan-summary">
        {joins.length === 1 ? "One join" : `${joins.length} joins`}: {muddy === 0 ? "none muddy" : `${muddy} muddy`},{" "}
        {takeovers === 0 ? "no takeover" : `${takeovers} with a dark ink that could take over`}.
      </p>
      <div className="grid gap-3 md:grid-cols-2">
        {joins.map((facts, i) => (
          <JoinHints key={i} first={inks[i]!} second={inks[i + 1]!} facts={facts} bridgeHref={bridgeHref?.(inks[i]!, inks[i + 1]!)} />
        ))}
      </div>
      <p className="text-sm text-ink-muted">
        Joins are predicted with the blend model the strip analysis fits to real strips: dye laid over dye, straight in
        optical density (Beer–Lambert). {STEP_SCALE} Screens show colours a little differently from ink on paper.
      </p>
    </div>
  );
}
