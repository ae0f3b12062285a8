import { Link } from "react-router";
import type { Ink } from "../../../../shared/schemas/inks";
import { ColourSwatch } from "../../../components/ui/colour-swatch";
import { colourWords } from "../../../lib/colour-words";
import { formatHex } from "../../../lib/format";

type PlanInkOrderProps = {
  ids: readonly number[];
  inks: ReadonlyMap<number, Ink>;
  onMove: (index: number, step: -1 | 1) => void;
  onRemove: (index: number) => void;
};

const iconButton = "grid min-h-11 min-w-11 place-items-center rounded-md text-ink-soft hover:bg-paper-shade hover:text-ink disabled:opacity-40";

/** The plan's inks in order, each movable one place earlier or later, and removable. */
export function PlanInkOrder({ ids, inks, onMove, onRemove }: PlanInkOrderProps) {
  if (!ids.length) return null;
  return (
    <ol aria-label="Ink order" className="flex flex-col gap-2">
      {ids.map((id, i) => {
        const ink = inks.get(id);
        const name = ink?.name ?? `Ink #${id}`;
        return (
          <li key={`${id}-${i}`} className="flex flex-wrap items-center gap-x-2 rounded-lg border border-rule bg-card p-1.5">
            <span className="w-6 text-center font-bold text-ink-muted tabular-nums">{i + 1}</span>
            {ink ? <ColourSwatch hex={ink.hex} className="h-9 w-12" /> : <span className="h-9 w-12 rounded-md bg-paper-shade" />}
            <span className="min-w-0 flex-1 basis-40 leading-tight">
              <Link to={`/inks/${id}`} className="block font-bold hover:underline">
                {name}
              </Link>
              {ink && (
                <>
                  <span className="block text-sm text-ink-soft">{ink.brand.name}</span>
                  <span className="block text-sm text-ink-soft">
                    {colourWords(ink.lab)} · <span className="tabular-nums">{formatHex(ink.hex)}</span>
                  </span>
                </>
              )}
            </span>
            <span className="ml-auto flex">
              <button type="button" className={iconButton} disabled={i === 0} onClick={() => onMove(i, -1)} aria-label={`Move ${name} earlier`}>
                <span aria-hidden="true">↑</span>
              </button>
              <button type="button" className={iconButton} disabled={i === ids.length - 1} onClick={() => onMove(i, 1)} aria-label={`Move ${name} later`}>
                <span aria-hidden="true">↓</span>
              </button>
              <button type="button" className={iconButton} onClick={() => onRemove(i)} aria-label={`Remove ${name} from the plan`}>
                <span aria-hidden="true" className="text-xl leading-none">×</span>
              </button>
            </span>
          </li>
        );
      })}
    </ol>
  );
}
