import { Link } from "react-router";
import type { Ink } from "../../../../shared/schemas/inks";
import type { JoinFacts } from "../../../../shared/colour/joins";
import { MUDDY_CHROMA_RATIO } from "../../../../shared/colour/joins";
import { ColourSwatch } from "../../../components/ui/colour-swatch";
import { colourWords } from "../../../lib/colour-words";
import { formatHex, formatNumber } from "../../../lib/format";

type JoinHintsProps = {
  first: Ink;
  second: Ink;
  facts: JoinFacts;
  /** Where "find a bridge" for this join leads (the bridge finder, filled in). */
  bridgeHref?: string;
};

const percent = (x: number) => `${Math.round(x * 100)} %`;

/** What to expect at one join, in words and numbers: the step, the middle, muddy and takeover. */
export function JoinHints({ first, second, facts, bridgeHref }: JoinHintsProps) {
  const dark = facts.takeover === "first" ? first : facts.takeover === "second" ? second : null;
  const light = facts.takeover === "first" ? second : first;
  return (
    <div className="flex flex-col gap-2 rounded-lg border border-rule bg-card p-3" data-testid="join-hints">
      <h3 className="font-bold">
        {first.name} <span aria-hidden="true">→</span>
        <span className="sr-only"> into </span> {second.name}
      </h3>
      <p>
        Step: <strong>{facts.words}</strong> (ΔE2000 <span className="tabular-nums">{formatNumber(facts.deltaE)}</span>)
      </p>
      <p className="flex items-center gap-2">
        <ColourSwatch hex={facts.middle.hex} className="h-6 w-8" />
        <span>
          Middle of the join: {colourWords(facts.middle.lab)}, <span className="tabular-nums">{formatHex(facts.middle.hex)}</span>
        </span>
      </p>
      {facts.muddy && (
        <p className="rounded-md border border-warn/40 bg-warn-soft p-2" data-testid="muddy-join">
          <strong>Muddy join:</strong> the middle keeps only {percent(facts.chromaRatio)} of the colour strength (chroma{" "}
          <span className="tabular-nums">{formatNumber(facts.chroma.middle)}</span> against{" "}
          <span className="tabular-nums">{formatNumber(Math.min(facts.chroma.first, facts.chroma.second))}</span>) of the
          weaker ink — below our line of {percent(MUDDY_CHROMA_RATIO)}. Put a bridge ink between them
          {bridgeHref ? (
            <>
              : <Link to={bridgeHref}>find a bridge</Link>.
            </>
          ) : (
            "."
          )}
        </p>
      )}
      {dark && (
        <p className="rounded-md border border-rule-strong bg-paper-shade p-2" data-testid="takeover">
          <strong>Takeover:</strong> {dark.name} (L* <span className="tabular-nums">{formatNumber(dark.lab.l)}</span>) is far
          darker than {light.name} (L* <span className="tabular-nums">{formatNumber(light.lab.l)}</span>). Blend the dark ink
          in lightly, working from the {light.name} side.
        </p>
      )}
      {!facts.muddy && !dark && <p className="text-sm text-ink-muted">No muddy join or takeover expected.</p>}
    </div>
  );
}
