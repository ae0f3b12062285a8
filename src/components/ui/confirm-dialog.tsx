import { useEffect, useId, useRef, type ReactNode } from "react";
import { Button } from "./button";

type ConfirmDialogProps = {
  open: boolean;
  title: string;
  children?: ReactNode;
  confirmLabel: string;
  busyLabel?: string;
  busy?: boolean;
  cancelLabel?: string;
  tone?: "danger" | "primary";
  onConfirm: () => void;
  onCancel: () => void;
};

/**
 * A modal question built on <dialog>: the browser keeps focus inside, Escape cancels, and focus
 * returns to whatever opened it. The safe choice (cancel) has the first focus.
 */
export function ConfirmDialog({
  open,
  title,
  children,
  confirmLabel,
  busyLabel,
  busy = false,
  cancelLabel = "Cancel",
  tone = "danger",
  onConfirm,
  onCancel,
}: ConfirmDialogProps) {
  const id = useId();
  const dialog = useRef<HTMLDialogElement>(null);

  useEffect(() => {
    const el = dialog.current;
    if (!el) return;
    if (open && !el.open) el.showModal();
    if (!open && el.open) el.close();
  }, [open]);

  return (
    <dialog
      ref={dialog}
      aria-labelledby={`${id}-title`}
      aria-describedby={children ? `${id}-body` : undefined}
      onCancel={(e) => {
        e.preventDefault();
        if (!busy) onCancel();
      }}
      className="m-auto w-[min(28rem,calc(100vw-2rem))] rounded-xl border border-rule bg-card p-0 text-ink shadow-lifted backdrop:bg-ink/40"
    >
      <div className="flex flex-col gap-4 p-5 sm:p-6">
        <h2 id={`${id}-title`} className="text-xl font-bold">
          {title}
        </h2>
        {children && (
          <div id={`${id}-body`} className="text-ink-soft">
            {children}
          </div>
        )}
        <div className="flex flex-wrap justify-end gap-3">
          <Button variant="secondary" autoFocus onClick={onCancel} disabled={busy}>
            {cancelLabel}
          </Button>
          <Button variant={tone} onClick={onConfirm} busy={busy} busyLabel={busyLabel}>
            {confirmLabel}
          </Button>
        </div>
      </div>
    </dialog>
  );
}
