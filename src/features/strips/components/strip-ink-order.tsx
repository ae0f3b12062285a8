import { Link } from "react-router";
import type { StripInk } from "../../../../shared/schemas/strips";
import { ColourSwatch } from "../../../components/ui/colour-swatch";
import { colourWords } from "../../../lib/colour-words";
import { formatHex } from "../../../lib/format";

/** The ink order in full: each ink with its colour in words and numbers, linking to the ink. */
export function StripInkOrder({ inks }: { inks: StripInk[] }) {
  return (
    <ol className="flex flex-col gap-2" aria-label="Ink order">
      {inks.map((ink, i) => (
        <li key={ink.id}>
          <Link
            to={`/inks/${ink.id}`}
            className="flex min-h-11 items-center gap-3 rounded-lg border border-rule bg-card p-2.5 shadow-card hover:shadow-lifted"
          >
            <span className="grid h-8 w-8 shrink-0 place-items-center rounded-full bg-ink text-sm font-bold text-card tabular-nums">
              {i + 1}
            </span>
            <ColourSwatch hex={ink.hex} className="h-10 w-14" />
            <span className="min-w-0 leading-snug">
              <span className="block font-bold text-accent underline-offset-2 hover:underline">{ink.name}</span>
              <span className="block text-sm text-ink-soft">
                {ink.brand} · {colourWords(ink.lab)} · <span className="tabular-nums">{formatHex(ink.hex)}</span>
              </span>
            </span>
          </Link>
        </li>
      ))}
    </ol>
  );
}
