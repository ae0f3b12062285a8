import { useId, useState, type FormEvent } from "react";
import { binderInput, visibilities, type BinderSummary } from "../../../../shared/schemas/binders";
import { Button } from "../../../components/ui/button";
import { controlClasses, fieldErrorText } from "../../../components/ui/field";
import { visibilityLabels } from "./visibility-badge";

type NewBinderInlineFormProps = {
  busy: boolean;
  /** A problem from the server with the name (shown under the name box). */
  nameError?: string | null;
  onCreate: (values: { name: string; visibility: BinderSummary["visibility"] }) => void;
  onCancel: () => void;
};

/** The smallest "new binder" form: a name and private or public, inside the save panel. */
export function NewBinderInlineForm({ busy, nameError, onCreate, onCancel }: NewBinderInlineFormProps) {
  const id = useId();
  const [name, setName] = useState("");
  const [visibility, setVisibility] = useState<BinderSummary["visibility"]>("private");
  const [problem, setProblem] = useState<string | null>(null);
  const shown = problem ?? nameError ?? null;

  function submit(e: FormEvent) {
    e.preventDefault();
    // The panel may sit inside a page form; never let this submit reach it.
    e.stopPropagation();
    const parsed = binderInput.safeParse({ name, visibility });
    if (!parsed.success) {
      setProblem(fieldErrorText("Name", parsed.error.issues[0]?.message ?? "is not valid"));
      return;
    }
    setProblem(null);
    onCreate({ name: parsed.data.name, visibility: parsed.data.visibility });
  }

  return (
    <form noValidate onSubmit={submit} aria-label="New binder" className="flex flex-col gap-3 rounded-lg border border-dashed border-rule-strong bg-paper p-3">
      <div className="flex flex-col gap-1.5">
        <label htmlFor={`${id}-name`} className="font-bold">
          Name of the new binder
        </label>
        <input
          id={`${id}-name`}
          value={name}
          maxLength={80}
          autoFocus
          autoComplete="off"
          onChange={(e) => setName(e.target.value)}
          onKeyDown={(e) => {
            if (e.key === "Escape") {
              // Close this form, not the whole panel.
              e.stopPropagation();
              onCancel();
            }
          }}
          aria-invalid={shown ? true : undefined}
          aria-describedby={shown ? `${id}-problem` : undefined}
          className={controlClasses}
        />
        {shown && (
          <p id={`${id}-problem`} role="alert" className="text-sm font-bold text-danger">
            {shown}
          </p>
        )}
      </div>
      <fieldset className="flex flex-wrap gap-x-5">
        <legend className="mb-1 font-bold">Who can see it</legend>
        {visibilities.map((v) => (
          <label key={v} className="flex min-h-11 items-center gap-2">
            <input
              type="radio"
              name={`${id}-visibility`}
              value={v}
              checked={visibility === v}
              onChange={() => setVisibility(v)}
              className="h-5 w-5 accent-accent"
            />
            <span>{v === "private" ? `${visibilityLabels[v]} (only you)` : `${visibilityLabels[v]} (shareable)`}</span>
          </label>
        ))}
      </fieldset>
      <div className="flex flex-wrap gap-2">
        <Button type="submit" busy={busy} busyLabel="Saving…">
          Create and save
        </Button>
        <Button variant="quiet" onClick={onCancel} disabled={busy}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
