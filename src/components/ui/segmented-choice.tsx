import { useId } from "react";

type SegmentedChoiceProps<T extends string> = {
  /** For screen readers: what is being chosen. */
  legend: string;
  /** The short visible word before the choices, e.g. "Sort:". */
  caption: string;
  options: readonly { value: T; label: string }[];
  value: T;
  onChange: (value: T) => void;
};

/** A few exclusive choices (radio buttons) drawn as one switch. */
export function SegmentedChoice<T extends string>({ legend, caption, options, value, onChange }: SegmentedChoiceProps<T>) {
  const name = useId();
  return (
    <fieldset className="flex flex-wrap items-center gap-2">
      <legend className="sr-only">{legend}</legend>
      <span aria-hidden="true" className="text-sm font-bold text-ink-soft">
        {caption}
      </span>
      <div className="inline-flex flex-wrap rounded-md border border-rule-strong bg-card p-0.5">
        {options.map((option) => (
          <label
            key={option.value}
            className="relative flex min-h-10 cursor-pointer items-center rounded px-3 font-bold text-ink-soft has-checked:bg-ink has-checked:text-card has-[:focus-visible]:outline-3 has-[:focus-visible]:outline-offset-2 has-[:focus-visible]:outline-accent"
          >
            <input
              type="radio"
              name={name}
              value={option.value}
              checked={value === option.value}
              onChange={() => onChange(option.value)}
              // Covers its label, so a click anywhere on the word lands on the radio itself.
              className="absolute inset-0 m-0 cursor-pointer appearance-none rounded opacity-0"
            />
            {option.label}
          </label>
        ))}
      </div>
    </fieldset>
  );
}
