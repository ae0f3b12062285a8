import { Button } from "../../../components/ui/button";
import type { Loosening, SearchState } from "../search-state";

type NoResultsProps = {
  loosenings: Loosening[];
  onApply: (next: SearchState) => void;
  onClear: () => void;
};

/** Nothing matched: say so, and offer each way to loosen the search by one step. */
export function NoResults({ loosenings, onApply, onClear }: NoResultsProps) {
  return (
    <div className="rounded-xl border-2 border-dashed border-rule-strong bg-card/60 px-5 py-8" data-testid="no-results">
      <p className="text-xl font-bold">No strip matches all of this</p>
      <p className="mt-2 max-w-prose text-ink-soft">
        Every filter must hold at once. Loosen one of them and the search runs again:
      </p>
      <ul className="mt-4 flex flex-wrap gap-2">
        {loosenings.map((l) => (
          <li key={l.key}>
            <Button variant="secondary" onClick={() => onApply(l.next)}>
              {l.label}
            </Button>
          </li>
        ))}
        <li>
          <Button variant="quiet" onClick={onClear}>
            Start a new search
          </Button>
        </li>
      </ul>
    </div>
  );
}
