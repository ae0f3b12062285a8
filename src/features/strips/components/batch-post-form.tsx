import { useQueryClient } from "@tanstack/react-query";
import { useId, useRef, useState } from "react";
import { MAX_NOTES, paperLabels, papers, toolLabels, tools } from "../../../../shared/schemas/strips";
import type { StripReading } from "../../../../shared/schemas/uploads";
import { Button } from "../../../components/ui/button";
import { Checkbox, Field, SelectInput, TextArea } from "../../../components/ui/field";
import { FormAlert, Notice } from "../../../components/ui/notice";
import { errorMessage, isApiError } from "../../../lib/api-client";
import { plural } from "../../../lib/format";
import { createStrip } from "../api/create-strip";
import { memberKeys, stripKeys } from "../api/keys";
import type { InkColourLookup, InkPickerSlot } from "../ink-choice";
import { notesForServer } from "../notes-text";
import { draftProblem, type StripDraft } from "../strip-drafts";
import { StripDraftCard } from "./strip-draft-card";

type Paper = (typeof papers)[number];
type Tool = (typeof tools)[number];

type BatchPostFormProps = {
  uploadId: string;
  strips: Pick<StripReading, "bands" | "orientation">[];
  drafts: StripDraft[];
  onDraftsChange: (drafts: StripDraft[]) => void;
  inkColour: InkColourLookup;
  picker: InkPickerSlot;
  blockedReason: string | null;
  /** After a round of posting: which strips went (the page lists them). */
  onPosted: (results: BatchResult[]) => void;
};

export type BatchResult = { index: number; title: string } & ({ ok: true; id: number; status: "published" | "pending" } | { ok: false; message: string });

/**
 * A several-strip photo as a batch of drafts: one card per strip (tick it, check its title and
 * ink order), the paper, tools and notes they share, and one button that posts every ticked strip.
 */
export function BatchPostForm({ uploadId, strips, drafts, onDraftsChange, inkColour, picker, blockedReason, onPosted }: BatchPostFormProps) {
  const id = useId();
  const queryClient = useQueryClient();
  const [paper, setPaper] = useState<Paper | "">("");
  const [chosenTools, setChosenTools] = useState<Tool[]>([]);
  const [notes, setNotes] = useState("");
  const [errors, setErrors] = useState<{ form?: string; paper?: string; strips: Record<number, string> }>({ strips: {} });
  const [posting, setPosting] = useState(false);
  const paperRef = useRef<HTMLSelectElement>(null);
  const waiting = drafts.filter((d) => !d.posted);
  const ticked = drafts.map((d, index) => ({ d, index })).filter(({ d }) => d.ticked && !d.posted);

  function change(index: number, draft: StripDraft) {
    onDraftsChange(drafts.map((d, i) => (i === index ? draft : d)));
  }

  async function submit(e: React.FormEvent) {
    e.preventDefault();
    if (blockedReason || posting) return;
    const found: { form?: string; paper?: string; strips: Record<number, string> } = { strips: {} };
    if (ticked.length === 0) found.form = "Tick at least one strip to post.";
    if (!paper) found.paper = "Choose the paper the strips are on.";
    for (const { d, index } of ticked) {
      const problem = draftProblem(d);
      if (problem) found.strips[index] = problem;
    }
    const count = Object.keys(found.strips).length;
    if (found.form || found.paper || count) {
      if (!found.form && count) found.form = `${plural(count, "strip")} ${count === 1 ? "needs" : "need"} a little more before posting: see below.`;
      setErrors(found);
      if (found.paper) paperRef.current?.focus();
      return;
    }
    setErrors({ strips: {} });
    setPosting(true);
    const results: BatchResult[] = [];
    let next = drafts;
    // One at a time, in order, so each answer (or refusal) belongs to its own strip.
    for (const { d, index } of ticked) {
      try {
        const created = await createStrip({
          uploadId,
          stripIndex: index,
          title: d.title.trim(),
          notes: notesForServer(notes),
          paper: paper as Paper,
          tools: chosenTools,
          inks: d.inks.map((i) => i.id),
        });
        results.push({ index, title: d.title.trim(), ok: true, id: created.id, status: created.status });
        next = next.map((x, i) => (i === index ? { ...x, posted: created, problem: undefined } : x));
      } catch (error) {
        const message = isApiError(error) && error.code === "already_posted" ? "It was already posted." : errorMessage(error);
        results.push({ index, title: d.title.trim(), ok: false, message });
        next = next.map((x, i) => (i === index ? { ...x, problem: message } : x));
      }
    }
    setPosting(false);
    onDraftsChange(next);
    void queryClient.invalidateQueries({ queryKey: stripKeys.lists() });
    void queryClient.invalidateQueries({ queryKey: memberKeys.all });
    onPosted(results);
  }

  const label = ticked.length === 1 ? "Post 1 strip" : `Post ${ticked.length} strips`;
  return (
    <form noValidate onSubmit={(e) => void submit(e)} className="flex flex-col gap-8" aria-label="Post the strips of this photo">
      <section aria-labelledby={`${id}-drafts`} className="flex flex-col gap-4">
        <div className="space-y-1">
          <h2 id={`${id}-drafts`} className="text-2xl font-bold">
            One draft per strip
          </h2>
          <p className="text-ink-soft">
            Tick the strips to post and check each one's ink order. {waiting.length < drafts.length && `${plural(drafts.length - waiting.length, "strip")} of this photo already posted.`}
          </p>
        </div>
        <ol className="flex flex-col gap-4">
          {drafts.map((draft, index) =>
            strips[index] ? (
              <StripDraftCard
                key={index}
                index={index}
                reading={strips[index]!}
                draft={draft}
                onChange={(d) => change(index, d)}
                inkColour={inkColour}
                picker={picker}
                disabled={posting}
                error={errors.strips[index] ?? draft.problem}
              />
            ) : null,
          )}
        </ol>
      </section>

      <section aria-labelledby={`${id}-shared`} className="flex flex-col gap-5">
        <div className="space-y-1">
          <h2 id={`${id}-shared`} className="text-2xl font-bold">
            The same for every strip
          </h2>
          <p className="text-ink-soft">Paper, tools and notes go with each strip you post from this photo.</p>
        </div>
        <Notice tone="info" title="Post dried strips only">
          <p>Ink looks different wet and dry. Let the strips dry fully first (heat-set pigment where needed).</p>
        </Notice>
        <Field label="Paper" error={errors.paper}>
          {(f) => (
            <SelectInput
              ref={paperRef}
              id={f.id}
              aria-describedby={f.describedBy}
              aria-invalid={f.invalid || undefined}
              value={paper}
              onChange={(e) => setPaper(e.currentTarget.value as Paper | "")}
            >
              <option value="">Choose the paper…</option>
              {papers.map((p) => (
                <option key={p} value={p}>
                  {paperLabels[p]}
                </option>
              ))}
            </SelectInput>
          )}
        </Field>
        <fieldset>
          <legend className="font-bold">
            Tools <span className="font-normal text-ink-muted">(optional)</span>
          </legend>
          <div className="mt-1 grid gap-x-4 sm:grid-cols-3">
            {tools.map((t) => (
              <Checkbox
                key={t}
                label={toolLabels[t]}
                checked={chosenTools.includes(t)}
                onChange={(e) => setChosenTools((old) => (e.currentTarget.checked ? [...old, t] : old.filter((x) => x !== t)))}
              />
            ))}
          </div>
        </fieldset>
        <Field label="Notes" optional hint="How you blended them, what you would change. A blank line starts a new paragraph.">
          {(f) => <TextArea id={f.id} aria-describedby={f.describedBy} rows={4} maxLength={MAX_NOTES} value={notes} onChange={(e) => setNotes(e.currentTarget.value)} />}
        </Field>
      </section>

      <div className="flex flex-col gap-3 border-t border-rule pt-6">
        <FormAlert message={errors.form} />
        {blockedReason && (
          <Notice tone="warning" live>
            <p>{blockedReason}</p>
          </Notice>
        )}
        <div>
          <Button type="submit" busy={posting} busyLabel="Posting…" disabled={blockedReason !== null || waiting.length === 0} className="w-full sm:w-auto" data-testid="post-strips">
            {label}
          </Button>
        </div>
      </div>
    </form>
  );
}
