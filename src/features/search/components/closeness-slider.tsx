import { useEffect, useId, useState } from "react";
import { MAX_MAX_DELTA_E, MIN_MAX_DELTA_E } from "../../../../shared/schemas/search";
import { thresholdWords } from "../threshold-words";

const COMMIT_DELAY_MS = 350;

/**
 * How close a band must be to count (a ΔE2000 threshold), as a slider with the value in words.
 * The search follows once the slider rests, not on every step.
 */
export function ClosenessSlider({ value, onCommit }: { value: number; onCommit: (maxDeltaE: number) => void }) {
  const id = useId();
  const [draft, setDraft] = useState(value);
  const [shown, setShown] = useState(value);
  if (shown !== value) {
    // The address changed (back button, a suggestion): follow it.
    setShown(value);
    setDraft(value);
  }

  useEffect(() => {
    if (draft === value) return;
    const timer = window.setTimeout(() => onCommit(draft), COMMIT_DELAY_MS);
    return () => window.clearTimeout(timer);
  }, [draft, value, onCommit]);

  return (
    <div className="flex flex-col gap-1.5">
      <label htmlFor={id} className="font-bold">
        Closeness
      </label>
      <input
        id={id}
        type="range"
        min={MIN_MAX_DELTA_E}
        max={MAX_MAX_DELTA_E}
        step={0.5}
        value={draft}
        aria-valuetext={`ΔE2000 up to ${draft}: ${thresholdWords(draft)}`}
        aria-describedby={`${id}-words`}
        onChange={(e) => setDraft(Number(e.target.value))}
        className="h-11 w-full accent-accent"
      />
      <p id={`${id}-words`} className="text-sm text-ink-soft">
        <span className="font-bold text-ink">{thresholdWords(draft)}</span> — a band within ΔE2000{" "}
        <span className="tabular-nums">{draft}</span> of each colour.
      </p>
    </div>
  );
}
