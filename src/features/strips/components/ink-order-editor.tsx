import { useId, useRef, useState } from "react";
import { MAX_INKS } from "../../../../shared/schemas/strips";
import { ColourSwatch } from "../../../components/ui/colour-swatch";
import { colourWords } from "../../../lib/colour-words";
import { formatHex } from "../../../lib/format";
import type { InkChoice, InkColourLookup, InkPickerSlot } from "../ink-choice";
import { directionWords } from "../strip-words";

type InkOrderEditorProps = {
  inks: InkChoice[];
  onChange: (inks: InkChoice[]) => void;
  inkColour: InkColourLookup;
  picker: InkPickerSlot;
  orientation: "horizontal" | "vertical";
  /** The problem with the ink order, from the form or the server. */
  error?: string;
  disabled?: boolean;
  /** Said under the heading; defaults to the wording for a freshly analysed photo. */
  intro?: string;
};

type Focus = { id: number; action: "up" | "down" | "remove" } | { heading: true };

const smallButton =
  "inline-flex min-h-11 min-w-11 items-center justify-center rounded-md border border-rule-strong bg-card px-2.5 text-sm font-bold hover:bg-paper-shade disabled:cursor-not-allowed disabled:opacity-40";

/**
 * The ink order: the strip's inks from one end to the other. Inks are added with the catalogue
 * search, and moved or removed with buttons (keyboard and screen-reader friendly; no dragging
 * needed). Each change is announced.
 */
export function InkOrderEditor({ inks, onChange, inkColour, picker, orientation, error, disabled = false, intro }: InkOrderEditorProps) {
  const id = useId();
  const [announcement, setAnnouncement] = useState("");
  const buttons = useRef(new Map<string, HTMLButtonElement>());
  const heading = useRef<HTMLHeadingElement>(null);
  const pendingFocus = useRef<Focus | null>(null);
  const full = inks.length >= MAX_INKS;

  // After a move the same button (or its neighbour) keeps the focus, so a keyboard user can go on.
  const setButton = (key: string) => (el: HTMLButtonElement | null) => {
    if (el) buttons.current.set(key, el);
    else buttons.current.delete(key);
    const want = pendingFocus.current;
    if (el && want && "id" in want && key === `${want.id}-${want.action}` && !el.disabled) {
      pendingFocus.current = null;
      el.focus();
    }
  };

  function focusLater(target: Focus) {
    pendingFocus.current = target;
    // Refs run only for re-created elements; for moved ones, look the button up after paint.
    requestAnimationFrame(() => {
      const want = pendingFocus.current;
      if (!want) return;
      pendingFocus.current = null;
      if ("heading" in want) {
        heading.current?.focus();
        return;
      }
      const el = buttons.current.get(`${want.id}-${want.action}`);
      const fallback = buttons.current.get(`${want.id}-${want.action === "up" ? "down" : "up"}`);
      (el && !el.disabled ? el : fallback)?.focus();
    });
  }

  function move(index: number, step: -1 | 1) {
    const to = index + step;
    if (to < 0 || to >= inks.length) return;
    const next = [...inks];
    const [ink] = next.splice(index, 1);
    next.splice(to, 0, ink!);
    onChange(next);
    setAnnouncement(`${ink!.name} moved to position ${to + 1} of ${next.length}.`);
    focusLater({ id: ink!.id, action: step === -1 ? "up" : "down" });
  }

  function remove(index: number) {
    const ink = inks[index]!;
    const next = inks.filter((_, i) => i !== index);
    onChange(next);
    setAnnouncement(`${ink.name} removed from the ink order.`);
    const neighbour = next[index] ?? next[index - 1];
    focusLater(neighbour ? { id: neighbour.id, action: "remove" } : { heading: true });
  }

  function add(ink: InkChoice) {
    if (inks.some((i) => i.id === ink.id) || full) return;
    onChange([...inks, ink]);
    setAnnouncement(`${ink.name} added at position ${inks.length + 1}.`);
  }

  return (
    <section aria-labelledby={`${id}-title`} className="flex flex-col gap-4" data-testid="ink-order">
      <div className="space-y-1">
        <h2 id={`${id}-title`} ref={heading} tabIndex={-1} className="text-2xl font-bold">
          Ink order
        </h2>
        <p className="text-ink-soft">
          The inks as they sit on the strip, {directionWords(orientation)}.{" "}
          {intro ?? "We filled in the best suggestion for each band; change anything that is not right."}
        </p>
      </div>
      <p role="status" aria-live="polite" className="sr-only">
        {announcement}
      </p>
      {error && (
        <p id={`${id}-error`} role="alert" className="flex items-start gap-1.5 font-bold text-danger">
          <span aria-hidden="true">!</span>
          <span>{error}</span>
        </p>
      )}
      {inks.length === 0 ? (
        <p className="rounded-lg border border-dashed border-rule-strong bg-card/60 p-4 text-ink-soft">
          No inks yet. Add the inks of your strip below, in order.
        </p>
      ) : (
        <ol className="flex flex-col gap-2" aria-describedby={error ? `${id}-error` : undefined}>
          {inks.map((ink, index) => {
            const colour = ink.hex && ink.lab ? { hex: ink.hex, lab: ink.lab } : inkColour(ink.id);
            return (
              <li
                key={ink.id}
                className="flex flex-wrap items-center gap-x-3 gap-y-2 rounded-lg border border-rule bg-card p-2.5 shadow-card sm:flex-nowrap"
                data-testid="ink-order-item"
              >
                <span className="grid h-8 w-8 shrink-0 place-items-center rounded-full bg-ink text-sm font-bold text-card tabular-nums">
                  <span className="sr-only">Position </span>
                  {index + 1}
                </span>
                {colour ? (
                  <ColourSwatch hex={colour.hex} className="h-10 w-14" />
                ) : (
                  <span aria-hidden="true" className="h-10 w-14 shrink-0 rounded-md border border-dashed border-rule-strong" />
                )}
                <div className="min-w-0 flex-1 basis-32">
                  <p className="leading-tight font-bold">{ink.name}</p>
                  <p className="text-sm text-ink-soft">
                    {ink.brand}
                    {colour && (
                      <>
                        {" · "}
                        {colourWords(colour.lab)} · <span className="tabular-nums">{formatHex(colour.hex)}</span>
                      </>
                    )}
                  </p>
                  {ink.band !== undefined && <p className="text-sm text-ink-muted">Suggested for band {ink.band + 1}</p>}
                </div>
                <div className="ml-auto flex gap-1.5">
                  <button
                    ref={setButton(`${ink.id}-up`)}
                    type="button"
                    className={smallButton}
                    disabled={disabled || index === 0}
                    onClick={() => move(index, -1)}
                  >
                    <span aria-hidden="true">↑</span>
                    <span className="sr-only">Move {ink.name} up</span>
                    <span aria-hidden="true" className="ml-1">
                      Up
                    </span>
                  </button>
                  <button
                    ref={setButton(`${ink.id}-down`)}
                    type="button"
                    className={smallButton}
                    disabled={disabled || index === inks.length - 1}
                    onClick={() => move(index, 1)}
                  >
                    <span aria-hidden="true">↓</span>
                    <span className="sr-only">Move {ink.name} down</span>
                    <span aria-hidden="true" className="ml-1">
                      Down
                    </span>
                  </button>
                  <button
                    ref={setButton(`${ink.id}-remove`)}
                    type="button"
                    className={`${smallButton} text-danger`}
                    disabled={disabled}
                    onClick={() => remove(index)}
                  >
                    <span aria-hidden="true">×</span>
                    <span className="sr-only">Remove {ink.name}</span>
                    <span aria-hidden="true" className="ml-1">
                      Remove
                    </span>
                  </button>
                </div>
              </li>
            );
          })}
        </ol>
      )}
      <div className="rounded-lg border border-rule bg-paper p-3">
        {full ? (
          <p className="text-ink-soft">A strip can have at most {MAX_INKS} inks. Remove one to add another.</p>
        ) : (
          picker({ onPick: add, chosenIds: inks.map((i) => i.id), disabled })
        )}
      </div>
    </section>
  );
}
