import { useId } from "react";
import type { SearchSort } from "../../../../shared/schemas/search";

const labels: Record<SearchSort, string> = { closest: "Closest colour", newest: "Newest", saves: "Most saved" };

/** The result order; "closest colour" is offered only when the search has a colour. */
export function SearchSortSwitch({ value, hasColour, onChange }: { value: SearchSort; hasColour: boolean; onChange: (sort: SearchSort) => void }) {
  const name = useId();
  const sorts: SearchSort[] = hasColour ? ["closest", "newest", "saves"] : ["newest", "saves"];
  return (
    <fieldset className="flex flex-wrap items-center gap-2">
      <legend className="sr-only">Order of the results</legend>
      <span aria-hidden="true" className="text-sm font-bold text-ink-soft">
        Order:
      </span>
      <div className="inline-flex flex-wrap rounded-md border border-rule-strong bg-card p-0.5">
        {sorts.map((sort) => (
          <label
            key={sort}
            className="relative flex min-h-10 cursor-pointer items-center rounded px-3 font-bold text-ink-soft has-checked:bg-ink has-checked:text-card has-[:focus-visible]:outline-3 has-[:focus-visible]:outline-offset-2 has-[:focus-visible]:outline-accent"
          >
            <input
              type="radio"
              name={name}
              value={sort}
              checked={value === sort}
              onChange={() => onChange(sort)}
              className="absolute inset-0 m-0 cursor-pointer appearance-none rounded opacity-0"
            />
            {labels[sort]}
          </label>
        ))}
      </div>
    </fieldset>
  );
}
