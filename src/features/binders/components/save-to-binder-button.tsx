import { useEffect, useId, useRef, useState, type CSSProperties } from "react";
import { Link, useLocation } from "react-router";
import type { BinderSummary } from "../../../../shared/schemas/binders";
import { Button, buttonClasses } from "../../../components/ui/button";
import { errorMessage, isApiError } from "../../../lib/api-client";
import { plural } from "../../../lib/format";
import { useAddBinderItem } from "../api/add-binder-item";
import { useCreateBinder } from "../api/create-binder";
import { useMyBinders } from "../api/get-my-binders";
import { useSavedIn } from "../api/get-saved-in";
import { useRemoveBinderItem } from "../api/remove-binder-item";
import { visibilityLabels } from "./visibility-badge";
import { NewBinderInlineForm } from "./new-binder-inline-form";

type SaveToBinderButtonProps = {
  stripId: number;
  /** The strip's save count as the page has it; shown beside the button and kept up to date. */
  saves?: number;
};

type Message = { tone: "error" | "done"; text: string };

const PANEL_MAX = 320;
const EDGE = 16;

/**
 * Where the panel goes, relative to the button's row: under it, lined up with its nearer side of
 * the screen, and moved in as needed to stay on screen (a 375 px phone too).
 */
function panelPlacement(anchor: DOMRect): CSSProperties {
  const width = Math.min(PANEL_MAX, window.innerWidth - 2 * EDGE);
  const onRight = anchor.left + anchor.width / 2 > window.innerWidth / 2;
  let left = onRight ? anchor.width - width : 0;
  left = Math.min(left, window.innerWidth - EDGE - width - anchor.left);
  left = Math.max(left, EDGE - anchor.left);
  return { width, left };
}

/** Words for an add or remove that failed, for the member to act on. */
function saveProblem(error: unknown, binderName: string): Message {
  if (isApiError(error)) {
    if (error.code === "already_saved" || error.status === 409) return { tone: "done", text: `This strip is already in “${binderName}”.` };
    if (error.status === 422) return { tone: "error", text: `${error.message} It was not added to “${binderName}”.` };
    if (error.status === 404) return { tone: "error", text: `“${binderName}” no longer exists. The list is updated.` };
  }
  return { tone: "error", text: errorMessage(error) };
}

/**
 * One click to keep a published strip: a small panel lists my binders with a check on those that
 * hold it; a click adds or removes it, and "New binder" makes one and saves into it. Visitors are
 * offered sign-in instead.
 */
export function SaveToBinderButton({ stripId, saves }: SaveToBinderButtonProps) {
  const id = useId();
  const location = useLocation();
  const binders = useMyBinders();
  const [open, setOpen] = useState(false);
  const [placement, setPlacement] = useState<CSSProperties>({});
  const wrapper = useRef<HTMLDivElement>(null);
  const button = useRef<HTMLButtonElement>(null);
  const panel = useRef<HTMLDivElement>(null);
  // The saved-in check is asked for only once the member opens the panel, not for every row.
  const [asked, setAsked] = useState(false);
  const savedIn = useSavedIn(stripId, asked && binders.data != null);
  const savedIds = savedIn.data;
  const isSaved = savedIds !== undefined && savedIds.length > 0;

  // The page's count was right when `saves` arrived; what this member did since moves it by one.
  const [baseline, setBaseline] = useState<{ saves: number | undefined; saved: boolean } | null>(null);
  if (savedIds !== undefined && (baseline === null || baseline.saves !== saves)) setBaseline({ saves, saved: isSaved });
  const shownSaves = saves === undefined ? undefined : Math.max(0, saves + (baseline ? Number(isSaved) - Number(baseline.saved) : 0));

  function close(returnFocus: boolean) {
    setOpen(false);
    if (returnFocus) button.current?.focus();
  }

  useEffect(() => {
    if (!open) return;
    const onPointer = (e: PointerEvent) => {
      if (!wrapper.current?.contains(e.target as Node)) setOpen(false);
    };
    const onKey = (e: KeyboardEvent) => {
      if (e.key === "Escape") {
        setOpen(false);
        button.current?.focus();
      }
    };
    document.addEventListener("pointerdown", onPointer);
    document.addEventListener("keydown", onKey);
    panel.current?.focus();
    return () => {
      document.removeEventListener("pointerdown", onPointer);
      document.removeEventListener("keydown", onKey);
    };
  }, [open]);

  const count =
    shownSaves === undefined ? null : (
      <span className="text-sm text-ink-soft tabular-nums" aria-live="polite">
        {plural(shownSaves, "save")}
      </span>
    );

  if (binders.data === null) {
    const next = `${location.pathname}${location.search}`;
    return (
      <div className="relative z-10 inline-flex flex-wrap items-center gap-x-3 gap-y-1">
        <Link
          to={`/sign-in?next=${encodeURIComponent(next)}`}
          className="inline-flex min-h-11 items-center rounded-md px-2 font-bold text-accent underline-offset-4 hover:bg-accent-soft hover:underline"
        >
          Sign in to save
        </Link>
        {count}
      </div>
    );
  }

  return (
    <div ref={wrapper} className={`relative inline-flex flex-wrap items-center gap-x-3 gap-y-1 ${open ? "z-20" : "z-10"}`}>
      <button
        ref={button}
        type="button"
        aria-expanded={open}
        aria-controls={`${id}-panel`}
        onClick={() => {
          if (open) return close(false);
          if (wrapper.current) setPlacement(panelPlacement(wrapper.current.getBoundingClientRect()));
          setAsked(true);
          setOpen(true);
        }}
        className={`inline-flex min-h-11 items-center gap-2 rounded-md border px-3 font-bold transition-colors ${
          isSaved ? "border-accent bg-accent-soft text-accent-deep hover:bg-accent-soft/70" : "border-rule-strong bg-card text-ink hover:bg-paper-shade"
        }`}
      >
        <span aria-hidden="true" className="text-base leading-none">
          {isSaved ? "✓" : "+"}
        </span>
        {isSaved ? "Saved" : "Save"}
        <span className="sr-only"> to a binder</span>
      </button>
      {count}
      {open && (
        <div
          ref={panel}
          id={`${id}-panel`}
          role="dialog"
          aria-labelledby={`${id}-title`}
          tabIndex={-1}
          style={placement}
          onBlur={(e) => {
            // Focus lost to nothing (a button turning busy) is not the member leaving the panel.
            const to = e.relatedTarget as Node | null;
            if (to && !wrapper.current?.contains(to)) setOpen(false);
          }}
          className="absolute top-full mt-2 flex max-h-[70vh] flex-col gap-3 overflow-y-auto rounded-lg border border-rule-strong bg-card p-3 text-left text-base font-normal text-ink shadow-lifted"
        >
          <SavePanelBody
            stripId={stripId}
            titleId={`${id}-title`}
            binders={binders.data}
            bindersError={binders.isError ? binders.error : null}
            onRetry={() => {
              void binders.refetch();
              void savedIn.refetch();
            }}
            savedIds={savedIds}
            savedInError={savedIn.isError ? savedIn.error : null}
            onClose={() => close(true)}
          />
        </div>
      )}
    </div>
  );
}

type SavePanelBodyProps = {
  stripId: number;
  titleId: string;
  binders: BinderSummary[] | undefined;
  bindersError: unknown;
  savedIds: number[] | undefined;
  savedInError: unknown;
  onRetry: () => void;
  onClose: () => void;
};

function SavePanelBody({ stripId, titleId, binders, bindersError, savedIds, savedInError, onRetry, onClose }: SavePanelBodyProps) {
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
