import { useEffect, useRef, useState } from "react";
import { Link } from "react-router";
import type { BinderSummary } from "../../../../shared/schemas/binders";
import { Button, buttonClasses } from "../../../components/ui/button";
import { errorMessage, isApiError } from "../../../lib/api-client";
import { plural } from "../../../lib/format";
import { useAddBinderItem } from "../api/add-binder-item";
import { useCreateBinder } from "../api/create-binder";
import { useRemoveBinderItem } from "../api/remove-binder-item";
import { NewBinderInlineForm } from "./new-binder-inline-form";
import { visibilityLabels } from "./visibility-badge";

type Message = { tone: "error" | "done"; text: string };

/** Words for an add or remove that failed, for the member to act on. */
function saveProblem(error: unknown, binderName: string): Message {
  if (isApiError(error)) {
    if (error.code === "already_saved" || error.status === 409) return { tone: "done", text: `This strip is already in “${binderName}”.` };
    if (error.status === 422) return { tone: "error", text: `${error.message} It was not added to “${binderName}”.` };
    if (error.status === 404) return { tone: "error", text: `“${binderName}” no longer exists. The list is updated.` };
  }
  return { tone: "error", text: errorMessage(error) };
}

export type SavePanelProps = {
  stripId: number;
  titleId: string;
  binders: BinderSummary[] | undefined;
  bindersError: unknown;
  savedIds: number[] | undefined;
  savedInError: unknown;
  onRetry: () => void;
  onClose: () => void;
};

/** Inside the save panel: my binders as on/off buttons, what happened, and "New binder". */
export function SavePanel({ stripId, titleId, binders, bindersError, savedIds, savedInError, onRetry, onClose }: SavePanelProps) {
  const add = useAddBinderItem();
  const remove = useRemoveBinderItem({ errorsShownInline: true });
  const create = useCreateBinder();
  const [pending, setPending] = useState<ReadonlySet<number>>(new Set());
  const [message, setMessage] = useState<Message | null>(null);
  const [creating, setCreating] = useState<boolean | null>(null);
  const [createError, setCreateError] = useState<string | null>(null);
  // With no binder yet, the form is the only thing to do: show it straight away.
  const showForm = creating ?? (binders !== undefined && binders.length === 0);
  const newBinderButton = useRef<HTMLButtonElement>(null);
  const returnFocus = useRef(false);

  // The form goes away under the keyboard's focus: hand focus to the button that replaces it.
  useEffect(() => {
    if (showForm || !returnFocus.current) return;
    returnFocus.current = false;
    newBinderButton.current?.focus();
  }, [showForm]);

  function closeForm() {
    returnFocus.current = true;
    setCreating(false);
    setCreateError(null);
  }

  const busy = (binderId: number, on: boolean) =>
    setPending((old) => {
      const next = new Set(old);
      if (on) next.add(binderId);
      else next.delete(binderId);
      return next;
    });

  async function toggle(binder: BinderSummary) {
    if (!savedIds || pending.has(binder.id)) return;
    const holds = savedIds.includes(binder.id);
    busy(binder.id, true);
    setMessage(null);
    try {
      if (holds) {
        await remove.mutateAsync({ binderId: binder.id, stripId });
        setMessage({ tone: "done", text: `Removed from “${binder.name}”.` });
      } else {
        await add.mutateAsync({ binderId: binder.id, stripId });
        setMessage({ tone: "done", text: `Saved to “${binder.name}”.` });
      }
    } catch (error) {
      setMessage(saveProblem(error, binder.name));
    } finally {
      busy(binder.id, false);
    }
  }

  async function createAndSave(values: { name: string; visibility: BinderSummary["visibility"] }) {
    setMessage(null);
    setCreateError(null);
    let binder;
    try {
      binder = await create.mutateAsync({ ...values, description: "" });
    } catch (error) {
      const nameProblem = isApiError(error) ? error.fields?.name?.join(" ") : undefined;
      if (nameProblem) setCreateError(`Name ${nameProblem}`);
      else setMessage({ tone: "error", text: `The binder was not created: ${errorMessage(error)}` });
      return;
    }
    closeForm();
    busy(binder.id, true);
    try {
      await add.mutateAsync({ binderId: binder.id, stripId });
      setMessage({ tone: "done", text: `Made “${binder.name}” and saved this strip to it.` });
    } catch (error) {
      const problem = saveProblem(error, binder.name);
      setMessage({ tone: problem.tone, text: `“${binder.name}” was made, but the strip was not saved: ${problem.text}` });
    } finally {
      busy(binder.id, false);
    }
  }

  let list;
  if (bindersError || savedInError) {
    list = (
      <div role="alert" className="flex flex-col items-start gap-2 text-sm">
        <p className="font-bold text-danger">Your binders could not be loaded.</p>
        <p className="text-ink-soft">{errorMessage(bindersError ?? savedInError)}</p>
        <Button variant="secondary" onClick={onRetry}>
          Try again
        </Button>
      </div>
    );
  } else if (!binders || !savedIds) {
    list = (
      <p role="status" className="flex items-center gap-2 text-ink-muted">
        <span aria-hidden="true" className="h-4 w-4 animate-spin rounded-full border-2 border-rule-strong border-r-accent" />
        Checking your binders…
      </p>
    );
  } else if (binders.length === 0) {
    list = <p className="text-ink-soft">You have no binders yet. Name your first one:</p>;
  } else {
    list = (
      <ul aria-label="Your binders" className="-mx-1 flex flex-col">
        {binders.map((b) => {
          const holds = savedIds.includes(b.id);
          const working = pending.has(b.id);
          return (
            <li key={b.id}>
              <button
                type="button"
                aria-pressed={holds}
                aria-busy={working || undefined}
                aria-disabled={working || undefined}
                onClick={() => void toggle(b)}
                className="flex min-h-11 w-full items-center gap-3 rounded-md px-2 py-1.5 text-left hover:bg-paper-shade aria-disabled:opacity-70"
              >
                <span
                  aria-hidden="true"
                  className={`grid h-6 w-6 shrink-0 place-items-center rounded border-2 text-sm font-bold ${
                    holds ? "border-accent bg-accent text-card" : "border-rule-strong bg-card"
                  }`}
                >
                  {working ? <span className="h-3 w-3 animate-spin rounded-full border-2 border-current border-r-transparent" /> : holds ? "✓" : ""}
                </span>
                <span className="min-w-0 flex-1">
                  <span className="block truncate font-bold">{b.name}</span>
                  <span className="block text-sm text-ink-muted">
                    {visibilityLabels[b.visibility]} · {plural(b.itemCount, "strip")}
                    {holds && <span className="sr-only"> · holds this strip</span>}
                  </span>
                </span>
              </button>
            </li>
          );
        })}
      </ul>
    );
  }

  return (
    <>
      <div className="flex items-start justify-between gap-2">
        <p id={titleId} className="pt-2 font-bold">
          Save to a binder
        </p>
        <button
          type="button"
          onClick={onClose}
          className="grid h-11 w-11 shrink-0 place-items-center rounded-md text-ink-soft hover:bg-paper-shade hover:text-ink"
        >
          <span aria-hidden="true" className="text-xl leading-none">
            ×
          </span>
          <span className="sr-only">Close</span>
        </button>
      </div>
      {list}
      <div aria-live="polite" role="status" className="empty:hidden">
        {message && (
          <p className={`text-sm font-bold ${message.tone === "error" ? "text-danger" : "text-success"}`}>
            {message.tone === "error" && <span aria-hidden="true">! </span>}
            {message.text}
          </p>
        )}
      </div>
      {binders && savedIds && !bindersError && !savedInError && (
        <>
          {showForm ? (
            <NewBinderInlineForm
              busy={create.isPending}
              nameError={createError}
              onCreate={(values) => void createAndSave(values)}
              onCancel={closeForm}
            />
          ) : (
            <button ref={newBinderButton} type="button" onClick={() => setCreating(true)} className={buttonClasses("secondary", "self-start")}>
              <span aria-hidden="true">+</span> New binder
            </button>
          )}
        </>
      )}
      <Link to="/binders" className="inline-flex min-h-11 items-center self-start text-sm font-bold text-accent hover:underline">
        Manage your binders
      </Link>
    </>
  );
}
