import type { Ink } from "../../../../shared/schemas/inks";
import { formatHex, formatNumber } from "../../../lib/format";
import { colourWords } from "../colour-words";

/** The ink's reference colour as words and numbers, for the detail page. */
export function InkColourFacts({ ink }: { ink: Ink }) {
  const rows: { term: string; detail: string; hint?: string; wide?: boolean }[] = [
    { term: "Colour", detail: colourWords(ink.lab), wide: true },
    { term: "Hex (sRGB)", detail: formatHex(ink.hex), wide: true },
    { term: "L*", detail: formatNumber(ink.lab.l), hint: "lightness, 0 black to 100 white" },
    { term: "a*", detail: formatNumber(ink.lab.a), hint: "green (−) to red (+)" },
    { term: "b*", detail: formatNumber(ink.lab.b), hint: "blue (−) to yellow (+)" },
  ];
  return (
    <dl className="grid grid-cols-1 gap-px overflow-hidden rounded-lg border border-rule bg-rule sm:grid-cols-6">
      {rows.map((r) => (
        <div key={r.term} className={`flex items-baseline justify-between gap-4 bg-card px-4 py-3 ${r.wide ? "sm:col-span-3" : "sm:col-span-2"}`}>
          <dt className="text-ink-soft">
            {r.term}
            {r.hint && <span className="block text-sm text-ink-muted">{r.hint}</span>}
          </dt>
          <dd className="text-lg font-bold tabular-nums">{r.detail}</dd>
        </div>
      ))}
    </dl>
  );
}
