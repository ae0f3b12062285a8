import { useQuery } from "@tanstack/react-query";
import { useEffect, useId, useRef, useState } from "react";
import type { Ink } from "../../../../shared/schemas/inks";
import { controlClasses } from "../../../components/ui/field";
import { errorMessage } from "../../../lib/api-client";
import { colourWords } from "../../../lib/colour-words";
import { formatHex } from "../../../lib/format";
import { inksQueryOptions } from "../api/get-inks";
import type { InkFilters } from "../ink-filters";
import { InkSwatch } from "./ink-swatch";

const TYPE_DELAY_MS = 250;
const RESULTS = 8;

type InkPickerProps = {
  label?: string;
  hint?: string;
  onPick: (ink: Ink) => void;
  /** Inks already chosen: shown, but not offered again. */
  chosenIds?: readonly number[];
  /**
   * The member's stash, once the stash exists: these inks are listed first and marked "in your
   * stash". (Hook left open on purpose: pass the stash's ink ids from the route.)
   */
  stashInkIds?: ReadonlySet<number>;
  disabled?: boolean;
  /** How a chosen ink is marked in the list. */
  chosenLabel?: string;
};

/** Stash inks first, otherwise the server's order (best name match first). */
export function orderPickerResults(inks: Ink[], stash: ReadonlySet<number> | undefined): Ink[] {
  if (!stash || stash.size === 0) return inks;
  return [...inks.filter((i) => stash.has(i.id)), ...inks.filter((i) => !stash.has(i.id))];
}

/**
 * A type-ahead over the ink catalogue (GET /api/inks?q=…), as an ARIA combobox: arrows move
 * through the results, Enter picks, Escape closes.
 */
export function InkPicker({
  label = "Add an ink",
  hint = "Type part of an ink's name or its brand.",
  onPick,
  chosenIds = [],
  stashInkIds,
  disabled = false,
  chosenLabel = "already chosen",
}: InkPickerProps) {
  const id = useId();
  const input = useRef<HTMLInputElement>(null);
  const list = useRef<HTMLUListElement>(null);
  const [text, setText] = useState("");
  const [query, setQuery] = useState("");
  const [open, setOpen] = useState(false);
  const [active, setActive] = useState(-1);

  useEffect(() => {
    const trimmed = text.trim();
    const timer = window.setTimeout(() => setQuery(trimmed), TYPE_DELAY_MS);
    return () => window.clearTimeout(timer);
  }, [text]);

  const filters: InkFilters = { q: query, discontinued: "include", page: 1, pageSize: RESULTS };
  const inks = useQuery({ ...inksQueryOptions(filters), enabled: query.length > 0, meta: { errorsShownInline: true } });
  const results = query ? orderPickerResults(inks.data?.items ?? [], stashInkIds) : [];
  const chosen = new Set(chosenIds);
  const showList = open && query.length > 0 && text.trim().length > 0;
  const activeInk = showList && active >= 0 ? results[active] : undefined;

  // New results: nothing is highlighted until the member moves into the list.
  const [resultsFor, setResultsFor] = useState(inks.data);
  if (resultsFor !== inks.data) {
    setResultsFor(inks.data);
    setActive(-1);
  }

  // On a phone the list often opens below the fold (or under the keyboard): bring it into view.
  const hasResults = showList && results.length > 0;
  useEffect(() => {
    if (hasResults) list.current?.scrollIntoView({ block: "nearest" });
  }, [hasResults]);

  // Keep the highlighted option visible while moving through a long list.
  useEffect(() => {
    if (active >= 0) list.current?.children[active]?.scrollIntoView({ block: "nearest" });
  }, [active]);

  function pick(ink: Ink) {
    if (chosen.has(ink.id)) return;
    onPick(ink);
    setText("");
    setQuery("");
    setOpen(false);
    setActive(-1);
    input.current?.focus();
  }

  function move(step: number) {
    if (!results.length) return;
    setOpen(true);
    setActive((current) => (current + step + results.length) % results.length);
  }

  let status = "";
  if (showList) {
    if (inks.isError) status = `The inks could not be searched: ${errorMessage(inks.error)}`;
    else if (inks.isFetching && !inks.data) status = "Searching…";
    else if (results.length === 0) status = `No ink matches “${query}”.`;
    else status = `${results.length === RESULTS ? `First ${RESULTS}` : results.length} ${results.length === 1 ? "ink" : "inks"} found. Use the arrow keys to choose.`;
  }

  return (
    <div className="relative flex flex-col gap-1.5">
      <label htmlFor={`${id}-input`} className="font-bold">
        {label}
      </label>
      {hint && (
        <p id={`${id}-hint`} className="text-sm text-ink-muted">
          {hint}
        </p>
      )}
      <input
        ref={input}
        id={`${id}-input`}
        type="text"
        role="combobox"
        aria-autocomplete="list"
        aria-expanded={showList}
        aria-controls={`${id}-list`}
        aria-activedescendant={activeInk ? `${id}-option-${activeInk.id}` : undefined}
        aria-describedby={hint ? `${id}-hint` : undefined}
        autoComplete="off"
        spellCheck={false}
        enterKeyHint="search"
        maxLength={100}
        placeholder="Search inks, e.g. bloom"
        disabled={disabled}
        value={text}
        className={controlClasses}
        onChange={(e) => {
          setText(e.target.value);
          setOpen(true);
        }}
        onFocus={() => setOpen(true)}
        onBlur={() => setOpen(false)}
        onKeyDown={(e) => {
          if (e.key === "ArrowDown") {
            e.preventDefault();
            move(1);
          } else if (e.key === "ArrowUp") {
            e.preventDefault();
            move(-1);
          } else if (e.key === "Enter") {
            // Enter inside a form must not submit it while choosing an ink.
            e.preventDefault();
            const target = activeInk ?? (results.length === 1 ? results[0] : undefined);
            if (target) pick(target);
          } else if (e.key === "Escape") {
            if (showList) e.preventDefault();
            setOpen(false);
            setActive(-1);
          }
        }}
      />
      <p role="status" className="sr-only">
        {status}
      </p>
      <ul
        ref={list}
        id={`${id}-list`}
        role="listbox"
        aria-label={`${label}: results`}
        hidden={!showList}
        className="absolute top-full right-0 left-0 z-20 mt-1 max-h-80 overflow-y-auto rounded-lg border border-rule-strong bg-card p-1 shadow-lifted"
      >
        {results.map((ink, i) => {
          const already = chosen.has(ink.id);
          const inStash = stashInkIds?.has(ink.id) ?? false;
          return (
            <li
              key={ink.id}
              id={`${id}-option-${ink.id}`}
              role="option"
              aria-selected={i === active}
              aria-disabled={already || undefined}
              // mousedown would blur the input (closing the list) before the click lands.
              onMouseDown={(e) => e.preventDefault()}
              onClick={() => pick(ink)}
              onMouseEnter={() => setActive(i)}
              className={`flex min-h-11 cursor-pointer items-center gap-3 rounded-md px-2 py-1.5 ${
                i === active ? "bg-accent-soft" : ""
              } ${already ? "cursor-not-allowed opacity-60" : ""}`}
            >
              <InkSwatch hex={ink.hex} className="h-8 w-10" />
              <span className="min-w-0 flex-1">
                <span className="block leading-tight font-bold">{ink.name}</span>
                <span className="block text-sm text-ink-soft">
                  {ink.brand.name} · {colourWords(ink.lab)} · <span className="tabular-nums">{formatHex(ink.hex)}</span>
                </span>
              </span>
              {inStash && <span className="text-sm font-bold text-accent">in your stash</span>}
              {already && <span className="text-sm text-ink-muted">{chosenLabel}</span>}
            </li>
          );
        })}
        {showList && results.length === 0 && (
          <li role="presentation" className="px-3 py-2 text-ink-muted">
            {inks.isError ? "Search failed. Try again." : inks.isFetching ? "Searching…" : `No ink matches “${query}”.`}
          </li>
        )}
      </ul>
    </div>
  );
}
