import { useEffect, useId, useRef, useState } from "react";
import type { Ink } from "../../../../shared/schemas/inks";
import { ColourSwatch } from "../../../components/ui/colour-swatch";
import { controlClasses } from "../../../components/ui/field";
import { errorMessage } from "../../../lib/api-client";
import { colourWords } from "../../../lib/colour-words";
import { formatHex } from "../../../lib/format";
import { CATALOGUE_RESULTS, useCatalogueSearch } from "../api/search-catalogue";

const TYPE_DELAY_MS = 250;

type StashInkSearchProps = {
  /** Inks already in the stash: listed, marked, not offered again. */
  heldIds: ReadonlySet<number>;
  onPick: (ink: Ink) => void;
  /** An add is on its way: keep typing, but do not pick a second one yet. */
  busy?: boolean;
};

/**
 * Type-ahead over the ink catalogue (an ARIA combobox): arrows move through the results, Enter
 * adds the highlighted ink, Escape closes the list.
 */
export function StashInkSearch({ heldIds, onPick, busy = false }: StashInkSearchProps) {
  const id = useId();
  const input = useRef<HTMLInputElement>(null);
  const [text, setText] = useState("");
  const [query, setQuery] = useState("");
  const [open, setOpen] = useState(false);
  const [active, setActive] = useState(-1);

  useEffect(() => {
    const timer = window.setTimeout(() => setQuery(text.trim()), TYPE_DELAY_MS);
    return () => window.clearTimeout(timer);
  }, [text]);

  const search = useCatalogueSearch(query);
  const results = query ? (search.data?.items ?? []) : [];
  const showList = open && query.length > 0 && text.trim().length > 0;
  const activeInk = showList && active >= 0 ? results[active] : undefined;

  // New results: nothing is highlighted until the member moves into the list.
  const [resultsFor, setResultsFor] = useState(search.data);
  if (resultsFor !== search.data) {
    setResultsFor(search.data);
    setActive(-1);
  }

  function pick(ink: Ink) {
    if (heldIds.has(ink.id) || busy) return;
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
    if (search.isError) status = `The catalogue could not be searched: ${errorMessage(search.error)}`;
    else if (search.isFetching && !search.data) status = "Searching…";
    else if (results.length === 0) status = `No ink matches “${query}”.`;
    else
      status = `${results.length === CATALOGUE_RESULTS ? `First ${CATALOGUE_RESULTS}` : results.length} ${
        results.length === 1 ? "ink" : "inks"
      } found. Use the arrow keys to choose, Enter to add.`;
  }

  return (
    <div className="relative flex flex-col gap-1.5">
      <label htmlFor={`${id}-input`} className="font-bold">
        Add an ink you own
      </label>
      <p id={`${id}-hint`} className="text-sm text-ink-muted">
        Type part of its name or its brand, then choose it from the list.
      </p>
      <input
        ref={input}
        id={`${id}-input`}
        type="text"
        role="combobox"
        aria-autocomplete="list"
        aria-expanded={showList}
        aria-controls={`${id}-list`}
        aria-activedescendant={activeInk ? `${id}-option-${activeInk.id}` : undefined}
        aria-describedby={`${id}-hint`}
        autoComplete="off"
        spellCheck={false}
        enterKeyHint="search"
        maxLength={100}
        placeholder="Search the catalogue"
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
        id={`${id}-list`}
        role="listbox"
        aria-label="Catalogue inks"
        hidden={!showList}
        className="absolute top-full right-0 left-0 z-20 mt-1 max-h-80 overflow-y-auto rounded-lg border border-rule-strong bg-card p-1 shadow-lifted"
      >
        {results.map((ink, i) => {
          const held = heldIds.has(ink.id);
          return (
            <li
              key={ink.id}
              id={`${id}-option-${ink.id}`}
              role="option"
              aria-selected={i === active}
              aria-disabled={held || undefined}
              // mousedown would blur the input (closing the list) before the click lands.
              onMouseDown={(e) => e.preventDefault()}
              onClick={() => pick(ink)}
              onMouseEnter={() => setActive(i)}
              className={`flex min-h-11 cursor-pointer items-center gap-3 rounded-md px-2 py-1.5 ${i === active ? "bg-accent-soft" : ""} ${
                held ? "cursor-default opacity-70" : ""
              }`}
            >
              <ColourSwatch hex={ink.hex} className="h-8 w-10" />
              <span className="min-w-0 flex-1">
                <span className="block leading-tight font-bold">{ink.name}</span>
                <span className="block text-sm text-ink-soft">
                  {ink.brand.name} · {colourWords(ink.lab)} · <span className="tabular-nums">{formatHex(ink.hex)}</span>
                  {ink.discontinued && " · discontinued"}
                </span>
              </span>
              {held && <span className="shrink-0 text-sm font-bold text-accent">in your stash</span>}
            </li>
          );
        })}
        {showList && results.length === 0 && (
          <li role="presentation" className="px-3 py-2 text-ink-muted">
            {search.isError ? "Search failed. Try again." : search.isFetching ? "Searching…" : `No ink matches “${query}”.`}
          </li>
        )}
      </ul>
    </div>
  );
}
