import { useId, useState, type FormEvent } from "react";
import { hexToLab, isHex, normalizeHex } from "../../../../shared/colour";
import { Button } from "../../../components/ui/button";
import { ColourSwatch } from "../../../components/ui/colour-swatch";
import { controlClasses } from "../../../components/ui/field";
import { colourWords } from "../../../lib/colour-words";

type ColourChooserProps = {
  onAdd: (hex: string) => void;
  /** Colours already in the search (not added twice). */
  chosen: readonly string[];
  /** Set when no more colours may be added, with the reason. */
  full?: string;
};

/**
 * Pick a colour with the system colour picker or type its hex, then add it to the search. The
 * picked colour is named in words beside its swatch before it is added.
 */
export function ColourChooser({ onAdd, chosen, full }: ColourChooserProps) {
  const id = useId();
  const [hex, setHex] = useState("#3a8f8a");
  const [text, setText] = useState("#3a8f8a");
  const [error, setError] = useState<string | null>(null);

  function add(e: FormEvent) {
    e.preventDefault();
    const typed = text.trim().startsWith("#") ? text.trim() : `#${text.trim()}`;
    if (!isHex(typed)) {
      setError("Type a hex colour such as #3a8f8a (or pick one).");
      return;
    }
    const value = normalizeHex(typed);
    if (chosen.includes(value)) {
      setError(`${value} is already in the search.`);
      return;
    }
    setError(null);
    onAdd(value);
  }

  return (
    <form onSubmit={add} className="flex flex-col gap-2" aria-labelledby={`${id}-label`} noValidate>
      <p id={`${id}-label`} className="font-bold">
        Add a colour
      </p>
      <div className="flex flex-wrap items-end gap-2">
        <label className="flex flex-col gap-1 text-sm text-ink-soft">
          Pick
          <input
            type="color"
            value={hex}
            disabled={!!full}
            onChange={(e) => {
              setHex(e.target.value);
              setText(e.target.value);
              setError(null);
            }}
            className="h-11 w-14 cursor-pointer rounded-md border border-rule-strong bg-card p-1"
          />
        </label>
        <label className="flex min-w-0 flex-1 flex-col gap-1 text-sm text-ink-soft">
          or type its hex
          <input
            type="text"
            inputMode="text"
            autoComplete="off"
            spellCheck={false}
            maxLength={7}
            value={text}
            disabled={!!full}
            aria-invalid={!!error}
            aria-describedby={error ? `${id}-error` : `${id}-words`}
            onChange={(e) => {
              setText(e.target.value);
              setError(null);
              const v = e.target.value.trim();
              const withHash = v.startsWith("#") ? v : `#${v}`;
              if (isHex(withHash)) setHex(normalizeHex(withHash));
            }}
            className={`${controlClasses} font-mono`}
          />
        </label>
        <Button type="submit" variant="secondary" disabled={!!full}>
          Add colour
        </Button>
      </div>
      <p id={`${id}-words`} className="flex items-center gap-2 text-sm text-ink-soft">
        <ColourSwatch hex={hex} className="h-5 w-7" />
        {colourWords(hexToLab(hex))} · {hex}
      </p>
      {error && (
        <p id={`${id}-error`} role="alert" className="text-sm font-bold text-danger">
          {error}
        </p>
      )}
      {full && <p className="text-sm text-ink-muted">{full}</p>}
    </form>
  );
}
