import { useEffect, useId, useRef, useState, type CSSProperties } from "react";
import { Link, useLocation } from "react-router";
import { plural } from "../../../lib/format";
import { useMyBinders } from "../api/get-my-binders";
import { useSavedIn } from "../api/get-saved-in";
import { SavePanel } from "./save-panel";

type SaveToBinderButtonProps = {
  stripId: number;
  /** The strip's save count as the page has it; shown beside the button and kept up to date. */
  saves?: number;
};

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
          <SavePanel
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
