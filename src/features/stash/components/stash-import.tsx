import { useId, useRef, useState, type FormEvent } from "react";
import type { Ink } from "../../../../shared/schemas/inks";
import { MAX_STASH, stashCsvColumns, type StashImportPreview, type StashImportRow, type StashItem } from "../../../../shared/schemas/stash";
import { Badge, type BadgeTone } from "../../../components/ui/badge";
import { Button } from "../../../components/ui/button";
import { ColourSwatch } from "../../../components/ui/colour-swatch";
import { controlClasses } from "../../../components/ui/field";
import { FormAlert, Notice } from "../../../components/ui/notice";
import { toast } from "../../../components/ui/toast";
import { errorMessage, isApiError } from "../../../lib/api-client";
import { colourWords } from "../../../lib/colour-words";
import { formatHex, plural } from "../../../lib/format";
import { usePreviewStashImport } from "../api/preview-stash-import";
import { useReplaceStash } from "../api/replace-stash";
import { importPlan, type ImportPicks } from "../import-plan";

const MAX_FILE_BYTES = 1024 * 1024;

/** The server's `fields` ("line 3", "file") as sentences, by line number, whole-file ones first. */
function problemList(error: unknown): string[] {
  if (!isApiError(error) || !error.fields) return [];
  return Object.entries(error.fields)
    .map(([key, messages]) => {
      const line = /line\s+(\d+)/i.exec(key)?.[1];
      return { order: line ? Number(line) : -1, text: `${line ? `Line ${line}` : key === "file" ? "The file" : key}: ${messages.join("; ")}` };
    })
    .sort((a, b) => a.order - b.order)
    .map((p) => p.text);
}

const statusWords: Record<StashImportRow["status"], { label: string; tone: BadgeTone }> = {
  matched: { label: "Matched", tone: "accent" },
  ambiguous: { label: "Choose one", tone: "warning" },
  unmatched: { label: "Not found", tone: "neutral" },
};

function InkLine({ ink, held }: { ink: Ink; held?: boolean }) {
  return (
    <span className="flex min-w-0 items-center gap-2">
      <ColourSwatch hex={ink.hex} className="h-8 w-10" />
      <span className="min-w-0">
        <span className="block leading-tight font-bold">{ink.name}</span>
        <span className="block text-sm text-ink-soft">
          {ink.brand.name} · {colourWords(ink.lab)} · <span className="tabular-nums">{formatHex(ink.hex)}</span>
          {held && <span className="font-bold text-accent"> · already in your stash</span>}
        </span>
      </span>
    </span>
  );
}

type RowProps = {
  row: StashImportRow;
  heldIds: ReadonlySet<number>;
  pick: number | undefined;
  onPick: (inkId: number | undefined) => void;
};

function ImportRow({ row, heldIds, pick, onPick }: RowProps) {
  const id = useId();
  const status = statusWords[row.status];
  const said = [row.brand || "no brand", row.name || "no name"].join(", ");
  return (
    <li className="flex flex-col gap-2 rounded-lg border border-rule bg-card p-3" data-testid="stash-import-row">
      <p className="flex flex-wrap items-center gap-x-2 gap-y-1">
        <Badge tone={status.tone}>{status.label}</Badge>
        <span className="text-sm text-ink-muted tabular-nums">Line {row.line}</span>
        <span className="min-w-0 break-words">
          “{said}”{row.runningLow && <span className="text-ink-soft"> · running low</span>}
        </span>
      </p>
      {row.status === "matched" && row.ink && <InkLine ink={row.ink} held={heldIds.has(row.ink.id)} />}
      {row.status === "unmatched" && (
        <p className="text-sm text-ink-soft">
          No catalogue ink has this {row.brand ? "brand and name" : "name"}. Check the spelling in the file, or add the ink
          with the search box above.
        </p>
      )}
      {row.status === "ambiguous" && (
        <fieldset className="flex flex-col gap-1">
          <legend className="mb-1 text-sm font-bold">
            {plural(row.candidates.length, "ink")} {row.candidates.length === 1 ? "has" : "have"} this name. Which one is yours?
          </legend>
          {row.candidates.map((ink) => (
            <label key={ink.id} className="flex min-h-11 cursor-pointer items-center gap-3 rounded-md px-1 hover:bg-paper-shade">
              <input
                type="radio"
                name={`${id}-pick`}
                className="h-5 w-5 shrink-0 accent-accent"
                checked={pick === ink.id}
                onChange={() => onPick(ink.id)}
              />
              <InkLine ink={ink} held={heldIds.has(ink.id)} />
            </label>
          ))}
          <label className="flex min-h-11 cursor-pointer items-center gap-3 rounded-md px-1 hover:bg-paper-shade">
            <input
              type="radio"
              name={`${id}-pick`}
              className="h-5 w-5 shrink-0 accent-accent"
              checked={pick === undefined}
              onChange={() => onPick(undefined)}
            />
            <span>Skip this row</span>
          </label>
        </fieldset>
      )}
    </li>
  );
}

function ColumnsHelp() {
  return (
    <details className="rounded-lg border border-rule bg-paper p-3">
      <summary className="flex min-h-11 cursor-pointer items-center font-bold">How to lay out the file</summary>
      <div className="mt-2 flex flex-col gap-3 text-ink-soft">
        <p>
          A CSV text file (UTF-8, up to 1 MB and {MAX_STASH.toLocaleString("en-GB")} inks) whose <strong>first row names the columns</strong>:{" "}
          <code className="rounded bg-paper-shade px-1 font-bold text-ink">{stashCsvColumns.join(",")}</code>. Then one ink per row.
        </p>
        <dl className="grid gap-x-4 gap-y-1 sm:grid-cols-[auto_1fr]">
          <dt className="font-bold text-ink">brand</dt>
          <dd>The maker as the catalogue names it. May be left empty; then the ink's name alone must be unique.</dd>
          <dt className="font-bold text-ink">name</dt>
          <dd>The ink's name as the catalogue spells it (capitals do not matter).</dd>
          <dt className="font-bold text-ink">running_low</dt>
          <dd>Optional: “yes” (or true, y, 1) when the pad is running low; anything else means no.</dd>
        </dl>
        <pre className="overflow-x-auto rounded-md bg-card p-2 text-sm text-ink">
          {`brand,name,running_low\nKelpforth Dyeworks,Amber Quarry,no\n,Deep Sounding,yes`}
        </pre>
        <p className="text-sm">The “Download as CSV” file is in the same layout, so it can be read back in.</p>
      </div>
    </details>
  );
}

/**
 * Import a stash from a CSV file: the server reads it and says what each row matched; the member
 * settles the ambiguous rows; nothing is saved until "Add these inks to my stash".
 */
export function StashImport({ current }: { current: StashItem[] }) {
  const id = useId();
  const fileInput = useRef<HTMLInputElement>(null);
  const [file, setFile] = useState<File | null>(null);
  const [preview, setPreview] = useState<StashImportPreview | null>(null);
  const [picks, setPicks] = useState<ImportPicks>({});
  const [problem, setProblem] = useState<{ message: string; details: string[] } | null>(null);
  const read = usePreviewStashImport();
  const save = useReplaceStash();
  const heldIds = new Set(current.map((i) => i.ink.id));
  const plan = preview ? importPlan(current, preview, picks) : null;
  const unpicked = preview ? preview.rows.filter((r) => r.status === "ambiguous" && picks[r.line] === undefined).length : 0;

  function reset() {
    setFile(null);
    setPreview(null);
    setPicks({});
    setProblem(null);
    if (fileInput.current) fileInput.current.value = "";
  }

  async function submit(e: FormEvent) {
    e.preventDefault();
    setProblem(null);
    if (!file) {
      setProblem({ message: "Choose a CSV file first.", details: [] });
      return;
    }
    if (file.size > MAX_FILE_BYTES) {
      setProblem({ message: "That file is larger than 1 MB. A stash list is much smaller; is it the right file?", details: [] });
      return;
    }
    try {
      setPreview(await read.mutateAsync(file));
      setPicks({});
    } catch (error) {
      setPreview(null);
      setProblem({ message: errorMessage(error), details: problemList(error) });
    }
  }

  async function confirm() {
    if (!plan) return;
    setProblem(null);
    try {
      await save.mutateAsync({ items: plan.items });
    } catch (error) {
      setProblem({ message: `Nothing was saved: ${errorMessage(error)}`, details: problemList(error) });
      return;
    }
    toast.success(`${plural(plan.added.length, "ink")} added to your stash.`);
    reset();
  }

  return (
    <div className="flex flex-col gap-4">
      <ColumnsHelp />
      <form noValidate onSubmit={(e) => void submit(e)} className="flex flex-col gap-3">
        <div className="flex flex-col gap-1.5">
          <label htmlFor={`${id}-file`} className="font-bold">
            CSV file
          </label>
          <p id={`${id}-file-hint`} className="text-sm text-ink-muted">
            Columns <code className="font-bold text-ink-soft">{stashCsvColumns.join(",")}</code>, with that header row first;
            running_low may be left out.
          </p>
          <input
            ref={fileInput}
            id={`${id}-file`}
            type="file"
            aria-describedby={`${id}-file-hint`}
            accept=".csv,text/csv,text/plain"
            onChange={(e) => {
              setFile(e.target.files?.[0] ?? null);
              setPreview(null);
              setProblem(null);
            }}
            className={`${controlClasses} file:mr-3 file:rounded-md file:border-0 file:bg-paper-shade file:px-3 file:py-1.5 file:font-bold file:text-ink`}
          />
        </div>
        <div>
          <Button type="submit" variant="secondary" busy={read.isPending} busyLabel="Reading the file…">
            Check this file
          </Button>
        </div>
      </form>

      <FormAlert message={problem?.message} details={problem?.details} />

      {preview && plan && (
        <section aria-labelledby={`${id}-preview`} className="flex flex-col gap-3">
          <h3 id={`${id}-preview`} className="text-lg font-bold">
            What the file says
          </h3>
          <p role="status" className="text-ink-soft">
            {plural(preview.rows.length, "row")}: {preview.matched} matched, {preview.ambiguous} to choose, {preview.unmatched} not
            found. Nothing is saved yet.
          </p>
          <ol className="flex flex-col gap-2">
            {preview.rows.map((row) => (
              <ImportRow
                key={row.line}
                row={row}
                heldIds={heldIds}
                pick={picks[row.line]}
                onPick={(inkId) => setPicks((old) => ({ ...old, [row.line]: inkId }))}
              />
            ))}
          </ol>
          <Notice tone={plan.added.length ? "info" : "warning"} title={plan.added.length ? `${plural(plan.added.length, "ink")} will be added` : "No new inks to add"}>
            <ul className="list-disc space-y-0.5 pl-5">
              {plan.alreadyHeld > 0 && (
                <li>
                  {plural(plan.alreadyHeld, "row")} {plan.alreadyHeld === 1 ? "names an ink" : "name inks"} you already have (or
                  repeat an earlier row); nothing changes for {plan.alreadyHeld === 1 ? "it" : "them"}.
                </li>
              )}
              {unpicked > 0 && (
                <li>
                  {plural(unpicked, "row")} {unpicked === 1 ? "still needs" : "still need"} a choice; without one,{" "}
                  {unpicked === 1 ? "it is" : "they are"} skipped.
                </li>
              )}
              {preview.unmatched > 0 && (
                <li>
                  {plural(preview.unmatched, "row")} matched no ink and {preview.unmatched === 1 ? "is" : "are"} skipped.
                </li>
              )}
              <li>Inks already in your stash keep their “running low” marks.</li>
            </ul>
          </Notice>
          <div className="flex flex-wrap gap-3">
            <Button onClick={() => void confirm()} busy={save.isPending} busyLabel="Adding…" disabled={plan.added.length === 0}>
              Add these inks to my stash
            </Button>
            <Button variant="secondary" onClick={reset} disabled={save.isPending}>
              Discard this file
            </Button>
          </div>
        </section>
      )}
    </div>
  );
}
