import { useId, useState, type ReactNode } from "react";
import { MAX_INKS } from "../../../../shared/schemas/strips";
import type { ReviewQueueItem } from "../../../../shared/schemas/moderation";
import { Button } from "../../../components/ui/button";
import { Field, TextArea } from "../../../components/ui/field";
import { FormAlert, Notice } from "../../../components/ui/notice";
import { toast } from "../../../components/ui/toast";
import { errorMessage, isApiError } from "../../../lib/api-client";
import { formatNumber } from "../../../lib/format";
import { useCorrectInks } from "../api/correct-inks";
import { withoutReloadHint } from "../review-words";

/** An ink in the editor: what the list needs to show it. */
export type TagInk = { id: number; name: string; brand: string; hex?: string };

/**
 * The catalogue search, given by the page (the ink feature owns it): it calls `onPick` with the
 * chosen ink and should not offer `chosenIds` again.
 */
export type InkSearchSlot = (props: { onPick: (ink: TagInk) => void; chosenIds: readonly number[]; disabled: boolean }) => ReactNode;

type InkTagsEditorProps = {
  item: ReviewQueueItem;
  /** The version the moderator was looking at when they opened the editor. */
  expectedVersion: number;
  inkSearch?: InkSearchSlot;
  onDone: () => void;
  onCancel: () => void;
};

function move<T>(list: T[], from: number, to: number): T[] {
  if (to < 0 || to >= list.length) return list;
  const next = [...list];
  const [x] = next.splice(from, 1);
  next.splice(to, 0, x);
  return next;
}

/** Correct a strip's ink order: reorder, remove, add from the suggestions or the catalogue. */
export function InkTagsEditor({ item, expectedVersion, inkSearch, onDone, onCancel }: InkTagsEditorProps) {
  const id = useId();
  const correct = useCorrectInks();
  const { strip } = item;
  const [inks, setInks] = useState<TagInk[]>(() => strip.inks.map((i) => ({ id: i.id, name: i.name, brand: i.brand, hex: i.hex })));
  const [note, setNote] = useState("");
  const [failure, setFailure] = useState<{ message: string; details: string[] } | null>(null);
  const [status, setStatus] = useState("");

  const chosen = inks.map((i) => i.id);
  const full = inks.length >= MAX_INKS;
  const unchanged = inks.length === strip.inks.length && inks.every((ink, i) => ink.id === strip.inks[i].id);

  // Each suggested ink once, nearest first, with the band it was suggested for.
  const suggested = new Map<number, { ink: TagInk; band: number; deltaE: number }>();
  for (const s of item.suggestions) {
    for (const ink of s.inks) {
      const known = suggested.get(ink.inkId);
      if (!known || ink.deltaE < known.deltaE) {
        suggested.set(ink.inkId, { ink: { id: ink.inkId, name: ink.name, brand: ink.brand }, band: s.bandIndex, deltaE: ink.deltaE });
      }
    }
  }
  const offers = [...suggested.values()].filter((s) => !chosen.includes(s.ink.id)).sort((a, b) => a.band - b.band || a.deltaE - b.deltaE);

  function add(ink: TagInk) {
    if (chosen.includes(ink.id) || full) return;
    setInks((list) => [...list, ink]);
    setStatus(`${ink.name} added as ink ${inks.length + 1}.`);
  }

  async function save() {
    setFailure(null);
    if (inks.length === 0) {
      setFailure({ message: "Name at least one ink.", details: [] });
      return;
    }
    try {
      await correct.mutateAsync({ id: strip.id, input: { inks: chosen, note: note.trim(), expectedVersion } });
      toast.success(`Ink tags of “${strip.title}” corrected. The author is told.`);
      onDone();
    } catch (error) {
      const details = isApiError(error) && error.fields ? Object.values(error.fields).flat() : [];
      const late = isApiError(error) && error.status === 409;
      setFailure({ message: late ? `${withoutReloadHint(errorMessage(error))} The queue has been refreshed; open the editor again.` : errorMessage(error), details });
    }
  }

  return (
    <section
      data-no-shortcuts
      aria-labelledby={`${id}-title`}
      className="flex flex-col gap-3 rounded-lg border border-rule-strong bg-card p-3 sm:p-4"
      onKeyDown={(e) => {
        if (e.key === "Escape" && !correct.isPending) {
          e.stopPropagation();
          onCancel();
        }
      }}
    >
      <h4 id={`${id}-title`} className="font-bold">
        Correct the ink tags of “{strip.title}”
      </h4>
      <p className="text-sm text-ink-muted">In order along the strip. Saving tags the bands again and tells the author.</p>
      <FormAlert message={failure?.message} details={failure?.details} />
      <p role="status" className="sr-only">
        {status}
      </p>
      {inks.length === 0 ? (
        <Notice tone="warning">No inks left. Add at least one.</Notice>
      ) : (
        <ol className="flex flex-col gap-1.5" aria-label="Ink order">
          {inks.map((ink, i) => (
            <li key={ink.id} className="flex flex-wrap items-center gap-2 rounded-md border border-rule bg-paper/60 py-1 pr-1 pl-2">
              <span className="w-5 text-right font-bold tabular-nums text-ink-muted">{i + 1}.</span>
              <span className="min-w-0 flex-1">
                <span className="font-bold">{ink.name}</span> <span className="text-ink-soft">· {ink.brand}</span>
              </span>
              <span className="flex gap-1">
                <Button
                  variant="quiet"
                  className="min-w-11 px-2"
                  disabled={i === 0}
                  aria-label={`Move ${ink.name} earlier`}
                  onClick={() => {
                    setInks((list) => move(list, i, i - 1));
                    setStatus(`${ink.name} is now ink ${i}.`);
                  }}
                >
                  ↑
                </Button>
                <Button
                  variant="quiet"
                  className="min-w-11 px-2"
                  disabled={i === inks.length - 1}
                  aria-label={`Move ${ink.name} later`}
                  onClick={() => {
                    setInks((list) => move(list, i, i + 1));
                    setStatus(`${ink.name} is now ink ${i + 2}.`);
                  }}
                >
                  ↓
                </Button>
                <Button
                  variant="quiet"
                  className="min-w-11 px-2 text-danger"
                  aria-label={`Remove ${ink.name}`}
                  onClick={() => {
                    setInks((list) => list.filter((x) => x.id !== ink.id));
                    setStatus(`${ink.name} removed.`);
                  }}
                >
                  ×
                </Button>
              </span>
            </li>
          ))}
        </ol>
      )}
      {offers.length > 0 && (
        <div className="flex flex-col gap-1">
          <p className="text-sm font-bold">Add a suggested ink</p>
          <ul className="flex flex-wrap gap-1.5">
            {offers.map((o) => (
              <li key={o.ink.id}>
                <Button variant="secondary" className="min-h-9 px-2.5 py-1 text-sm" disabled={full} onClick={() => add(o.ink)}>
                  <span aria-hidden="true">+</span> {o.ink.name}
                  <span className="font-normal text-ink-muted">
                    band {o.band + 1}, ΔE {formatNumber(o.deltaE)}
                  </span>
                </Button>
              </li>
            ))}
          </ul>
        </div>
      )}
      {inkSearch?.({ onPick: add, chosenIds: chosen, disabled: full || correct.isPending })}
      {full && <p className="text-sm text-ink-muted">A strip has at most {MAX_INKS} inks.</p>}
      <Field label="Note to the author" optional hint="Say what was wrong, e.g. “the order was reversed”.">
        {(f) => (
          <TextArea
            id={f.id}
            aria-describedby={f.describedBy}
            rows={2}
            maxLength={1000}
            className="min-h-11"
            value={note}
            onChange={(e) => setNote(e.target.value)}
          />
        )}
      </Field>
      <div className="flex flex-wrap gap-2">
        <Button onClick={() => void save()} busy={correct.isPending} busyLabel="Saving…" disabled={unchanged || inks.length === 0}>
          Save ink tags
        </Button>
        <Button variant="secondary" onClick={onCancel} disabled={correct.isPending}>
          Cancel
        </Button>
      </div>
    </section>
  );
}
