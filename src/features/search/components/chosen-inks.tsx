import type { ReactNode } from "react";
import { Link } from "react-router";
import type { Ink } from "../../../../shared/schemas/inks";
import { ColourSwatch } from "../../../components/ui/colour-swatch";

type ChosenInksProps = {
  ids: readonly number[];
  /** The inks, once loaded (ids not yet loaded show as "Ink #id"). */
  inks: ReadonlyMap<number, Ink>;
  label: string;
  /** "Leave out" chips are struck through. */
  excluded?: boolean;
  onRemove: (id: number) => void;
  /** Extra line under an ink (e.g. its look-alikes). */
  extra?: (ink: Ink) => ReactNode;
};

/** The inks a search requires or leaves out, each with a remove button. */
export function ChosenInks({ ids, inks, label, excluded = false, onRemove, extra }: ChosenInksProps) {
  if (!ids.length) return null;
  return (
    <ul aria-label={label} className="flex flex-col gap-2">
      {ids.map((id) => {
        const ink = inks.get(id);
        const name = ink ? ink.name : `Ink #${id}`;
        return (
          <li key={id} className="rounded-lg border border-rule bg-card p-1.5 pr-1">
            <div className="flex items-center gap-3">
              {ink ? <ColourSwatch hex={ink.hex} className={`h-9 w-12 ${excluded ? "opacity-50" : ""}`} /> : <span className="h-9 w-12 rounded-md bg-paper-shade" />}
              <span className="min-w-0 flex-1 leading-tight">
                <Link to={`/inks/${id}`} className={`block font-bold hover:underline ${excluded ? "line-through decoration-2" : ""}`}>
                  {excluded && <span className="sr-only">Leaving out </span>}
                  {name}
                </Link>
                {ink && <span className="block text-sm text-ink-soft">{ink.brand.name}</span>}
              </span>
              <button
                type="button"
                onClick={() => onRemove(id)}
                className="grid min-h-11 min-w-11 place-items-center rounded-md text-ink-soft hover:bg-paper-shade hover:text-ink"
                aria-label={excluded ? `Stop leaving out ${name}` : `Remove ${name} from the search`}
              >
                <span aria-hidden="true" className="text-xl leading-none">×</span>
              </button>
            </div>
            {ink && extra?.(ink)}
          </li>
        );
      })}
    </ul>
  );
}
