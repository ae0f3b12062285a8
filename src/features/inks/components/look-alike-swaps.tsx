import type { Ink } from "../../../../shared/schemas/inks";
import { useLookAlikes } from "../api/get-look-alikes";

type LookAlikeSwapsProps = {
  ink: Ink;
  viewer: { id: string } | null | undefined;
  /** Inks already in the search: not offered. */
  exclude: readonly number[];
  /** Put this look-alike in the ink's place. */
  onSwap: (lookAlike: Ink) => void;
  max?: number;
};

/**
 * Under an ink in a search: its closest look-alikes in words, each a button that searches with
 * it instead (a blend with a look-alike usually looks much the same). Nothing when there are none.
 */
export function LookAlikeSwaps({ ink, viewer, exclude, onSwap, max = 3 }: LookAlikeSwapsProps) {
  const list = useLookAlikes(ink.id, viewer);
  const items = (list.data?.items ?? []).filter((l) => !exclude.includes(l.ink.id)).slice(0, max);
  if (!items.length) return null;
  return (
    <div className="mt-1.5 border-t border-rule px-1 pt-1.5 text-sm">
      <p className="text-ink-muted">Look-alikes, to search with instead:</p>
      <ul className="mt-1 flex flex-wrap gap-1.5">
        {items.map((l) => (
          <li key={l.ink.id}>
            <button
              type="button"
              onClick={() => onSwap(l.ink)}
              className="inline-flex min-h-9 items-center gap-1.5 rounded-full border border-rule-strong bg-card py-0.5 pr-2.5 pl-1 hover:border-ink-muted hover:bg-paper-shade"
              aria-label={`Search with ${l.ink.name} (${l.ink.brand.name}) instead of ${ink.name}: ${l.words}, ΔE2000 ${l.deltaE.toFixed(2)}${l.owned ? ", in your stash" : ""}`}
            >
              <span aria-hidden="true" className="swatch-ink h-6 w-6 rounded-full" style={{ backgroundColor: l.ink.hex }} />
              <span className="font-bold">{l.ink.name}</span>
              <span className="text-ink-muted">
                {l.words}
                {l.owned ? " · yours" : ""}
              </span>
            </button>
          </li>
        ))}
      </ul>
    </div>
  );
}
