import { useEffect, useId, useRef, useState } from "react";
import { binderItemPatch } from "../../../../shared/schemas/binders";
import { Button, buttonClasses } from "../../../components/ui/button";
import { controlClasses, fieldErrorText } from "../../../components/ui/field";
import { errorMessage } from "../../../lib/api-client";
import { useUpdateBinderItemNote } from "../api/update-binder-item-note";

type BinderItemNoteProps = {
  binderId: number;
  stripId: number;
  note: string;
  isOwner: boolean;
  /** The strip's title, to name the buttons for screen readers. */
  stripName: string;
};

/** The member's note on one strip in a binder ("try with a darker end"); the owner can edit it. */
export function BinderItemNote({ binderId, stripId, note, isOwner, stripName }: BinderItemNoteProps) {
  const id = useId();
  const [editing, setEditing] = useState(false);
  const [text, setText] = useState(note);
  const [problem, setProblem] = useState<string | null>(null);
  const save = useUpdateBinderItemNote();
  const editButton = useRef<HTMLButtonElement>(null);
  const returnFocus = useRef(false);

  // Closing the editor must not drop keyboard focus onto the page's start.
  useEffect(() => {
    if (editing || !returnFocus.current) return;
    returnFocus.current = false;
    editButton.current?.focus();
  }, [editing]);

  function close() {
    returnFocus.current = true;
    setEditing(false);
  }

  async function submit() {
    const parsed = binderItemPatch.safeParse({ note: text });
    if (!parsed.success) {
      setProblem(fieldErrorText("The note", parsed.error.issues[0]?.message ?? "is not valid"));
      return;
    }
    setProblem(null);
    try {
      await save.mutateAsync({ binderId, stripId, note: parsed.data.note });
      close();
    } catch (error) {
      setProblem(errorMessage(error));
    }
  }

  if (editing) {
    return (
      <form
        noValidate
        onSubmit={(e) => {
          e.preventDefault();
          void submit();
        }}
        className="flex flex-col gap-2"
      >
        <label htmlFor={`${id}-note`} className="font-bold">
          Your note on this strip <span className="font-normal text-ink-muted">(optional)</span>
        </label>
        <p id={`${id}-hint`} className="text-sm text-ink-muted">
          Only words, e.g. “try with a darker end”. {text.length} of 300 characters.
        </p>
        <textarea
          id={`${id}-note`}
          value={text}
          maxLength={300}
          rows={2}
          autoFocus
          onChange={(e) => setText(e.target.value)}
          onKeyDown={(e) => {
            if (e.key === "Escape") {
              setText(note);
              setProblem(null);
              close();
            }
          }}
          aria-invalid={problem ? true : undefined}
          aria-describedby={`${id}-hint${problem ? ` ${id}-problem` : ""}`}
          className={`${controlClasses} min-h-20`}
        />
        {problem && (
          <p id={`${id}-problem`} role="alert" className="text-sm font-bold text-danger">
            {problem}
          </p>
        )}
        <div className="flex flex-wrap gap-2">
          <Button type="submit" busy={save.isPending} busyLabel="Saving…">
            Save note
          </Button>
          <Button
            variant="quiet"
            onClick={() => {
              setText(note);
              setProblem(null);
              close();
            }}
          >
            Cancel
          </Button>
        </div>
      </form>
    );
  }

  return (
    <div className="flex flex-wrap items-start gap-x-3 gap-y-1">
      {note ? (
        <p className="min-w-0 flex-1 basis-60 rounded-md border-l-4 border-rule-strong bg-paper px-3 py-2 whitespace-pre-line break-words text-ink-soft">
          <span className="font-bold text-ink">Note: </span>
          {note}
        </p>
      ) : null}
      {isOwner && (
        <button
          ref={editButton}
          type="button"
          className={buttonClasses("quiet", "px-2")}
          onClick={() => {
            setText(note);
            setEditing(true);
          }}
        >
          {note ? "Edit note" : "Add a note"}
          <span className="sr-only"> on “{stripName}”</span>
        </button>
      )}
    </div>
  );
}
