import { Link } from "react-router";
import type { StripInk } from "../../../../shared/schemas/strips";
import { ColourSwatch } from "../../../components/ui/colour-swatch";

/** The ink order as small chips: swatch, name, brand, each a link to the ink. */
export function StripInkChips({ inks, label = "Ink order" }: { inks: StripInk[]; label?: string }) {
  return (
    <ol aria-label={label} className="grid grid-cols-2 gap-1.5 sm:flex sm:flex-wrap sm:gap-2">
      {inks.map((ink, i) => (
        <li key={ink.id} className="min-w-0">
          <Link
            to={`/inks/${ink.id}`}
            className="relative z-10 flex min-h-11 items-center gap-2 rounded-full border border-rule bg-paper py-1 pr-3 pl-1 hover:border-ink-muted hover:bg-paper-shade"
          >
            <ColourSwatch hex={ink.hex} className="h-7 w-7 rounded-full" />
            <span className="min-w-0 leading-tight">
              <span className="sr-only">{i + 1}. </span>
              <span className="block truncate text-sm font-bold">{ink.name}</span>
              <span className="block truncate text-xs text-ink-soft">{ink.brand}</span>
            </span>
          </Link>
        </li>
      ))}
    </ol>
  );
}
