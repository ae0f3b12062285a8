import { useId, useRef, useState, type FormEvent } from "react";
import type { InkImportResult } from "../../../../shared/schemas/inks";
import { Button } from "../../../components/ui/button";
import { Notice } from "../../../components/ui/notice";
import { errorMessage, isApiError } from "../../../lib/api-client";
import { plural } from "../../../lib/format";
import { useImportCatalogue } from "../api/import-catalogue";

type LineProblem = { key: string; line: number | null; messages: string[] };

/** Orders the server's `fields` ("line 3", "line 12", "file") by line number, others first. */
export function lineProblems(fields: Record<string, string[]> | undefined): LineProblem[] {
  if (!fields) return [];
  return Object.entries(fields)
    .map(([key, messages]) => {
      const match = /line\s+(\d+)/i.exec(key);
      return { key, line: match ? Number(match[1]) : null, messages };
    })
    .sort((x, y) => (x.line ?? -1) - (y.line ?? -1) || x.key.localeCompare(y.key));
}

const MAX_BYTES_HINT = "one .csv file, UTF-8";

export function CatalogueImportForm() {
  const id = useId();
  const fileRef = useRef<HTMLInputElement>(null);
  const [file, setFile] = useState<File | null>(null);
  const [missingFile, setMissingFile] = useState(false);
  const [result, setResult] = useState<InkImportResult | null>(null);
  const importCatalogue = useImportCatalogue();
  const error = importCatalogue.error;
  const problems = isApiError(error) ? lineProblems(error.fields) : [];

  async function submit(e: FormEvent) {
    e.preventDefault();
    setResult(null);
    if (!file) {
      setMissingFile(true);
      fileRef.current?.focus();
      return;
    }
    try {
      setResult(await importCatalogue.mutateAsync(file));
      setFile(null);
      if (fileRef.current) fileRef.current.value = "";
    } catch {
      // Shown below from the mutation's error.
    }
  }

  return (
    <form noValidate onSubmit={submit} className="flex flex-col gap-5">
      <div className="flex flex-col gap-1.5">
        <label htmlFor={`${id}-file`} className="font-bold">
          Catalogue file
        </label>
        <p id={`${id}-hint`} className="text-sm text-ink-muted">
          {MAX_BYTES_HINT}, with the header row described below.
        </p>
        <input
          ref={fileRef}
          id={`${id}-file`}
          name="file"
          type="file"
          accept=".csv,text/csv"
          aria-describedby={`${id}-hint${missingFile ? ` ${id}-missing` : ""}`}
          aria-invalid={missingFile || undefined}
          onChange={(e) => {
            setFile(e.target.files?.[0] ?? null);
            setMissingFile(false);
            setResult(null);
            importCatalogue.reset();
          }}
          className="block w-full min-h-11 rounded-md border border-dashed border-rule-strong bg-card p-2 file:mr-3 file:min-h-10 file:cursor-pointer file:rounded-md file:border-0 file:bg-accent-soft file:px-4 file:font-bold file:text-accent-deep"
        />
        {missingFile && (
          <p id={`${id}-missing`} className="text-sm font-bold text-danger">
            ! Choose a CSV file first.
          </p>
        )}
      </div>

      <div>
        <Button type="submit" busy={importCatalogue.isPending} busyLabel="Importing…">
          Import catalogue
        </Button>
      </div>

      {result && (
        <Notice tone="success" title="Import finished" live>
          <ul className="list-disc pl-5">
            <li>{plural(result.created, "ink")} added</li>
            <li>{plural(result.updated, "ink")} updated</li>
            <li>{plural(result.brandsCreated, "new brand")}</li>
          </ul>
        </Notice>
      )}

      {error && (
        <Notice tone="error" title={errorMessage(error)} live>
          {problems.length > 0 && (
            <>
              <p>
                Nothing was imported. Fix {problems.length === 1 ? "this line" : `these ${problems.length} problems`} and
                upload the file again:
              </p>
              <div
                role="region"
                aria-label="Problems by line"
                tabIndex={0}
                className="mt-2 max-h-96 overflow-auto rounded-md border border-danger/30 bg-card"
              >
                <ol className="divide-y divide-rule">
                  {problems.map((p) => (
                    <li key={p.key} className="grid grid-cols-[6.5rem_1fr] gap-3 px-3 py-2 text-ink">
                      <span className="font-bold capitalize tabular-nums">{p.key}</span>
                      <span>{p.messages.join(" ")}</span>
                    </li>
                  ))}
                </ol>
              </div>
            </>
          )}
        </Notice>
      )}
    </form>
  );
}
