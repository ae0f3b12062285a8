import { useId } from "react";
import { stripSorts } from "../../../../shared/schemas/strips";
import { sortLabels, type StripSort } from "../strip-filters";

/** Newest / most saved, as a pair of radio buttons styled as one switch. */
export function SortSwitch({ value, onChange }: { value: StripSort; onChange: (sort: StripSort) => void }) {
  const name = useId();
  return (
    <fieldset className="flex flex-wrap items-center gap-2">
      <legend className="sr-only">Sort strips</legend>
      <span aria-hidden="true" className="text-sm font-bold text-ink-soft">
        Sort:
      </span>
      <div className="inline-flex rounded-md border border-rule-strong bg-card p-0.5">
        {stripSorts.map((sort) => (
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
              // Covers its label, so a click anywhere on the word lands on the radio itself.
              className="absolute inset-0 m-0 cursor-pointer appearance-none rounded opacity-0"
            />
            {sortLabels[sort]}
          </label>
        ))}
      </div>
    </fieldset>
  );
}
