import { useEffect, useSyncExternalStore } from "react";

export type ToastTone = "error" | "success" | "info";
export type Toast = { id: number; tone: ToastTone; title?: string; message: string };

type Listener = () => void;

let toasts: Toast[] = [];
let nextId = 1;
const listeners = new Set<Listener>();

function emit() {
  for (const listener of listeners) listener();
}

function push(tone: ToastTone, message: string, title?: string): number {
  const id = nextId++;
  // The same message twice in a row (a double click) is shown once.
  toasts = [...toasts.filter((t) => !(t.tone === tone && t.message === message)), { id, tone, title, message }];
  if (toasts.length > 4) toasts = toasts.slice(-4);
  emit();
  return id;
}

export function dismissToast(id: number) {
  toasts = toasts.filter((t) => t.id !== id);
  emit();
}

/** Callable from anywhere, including outside React (the query client's error hook). */
export const toast = {
  error: (message: string, title?: string) => push("error", message, title),
  success: (message: string, title?: string) => push("success", message, title),
  info: (message: string, title?: string) => push("info", message, title),
  dismiss: dismissToast,
};

function subscribe(listener: Listener) {
  listeners.add(listener);
  return () => listeners.delete(listener);
}

export function useToasts(): Toast[] {
  return useSyncExternalStore(subscribe, () => toasts, () => toasts);
}

const toneStyles: Record<ToastTone, string> = {
  error: "border-danger/40 bg-danger-soft text-ink",
  success: "border-success/40 bg-success-soft text-ink",
  info: "border-rule-strong bg-card text-ink",
};

const toneMarks: Record<ToastTone, string> = {
  error: "bg-danger",
  success: "bg-success",
  info: "bg-accent",
};

const toneWords: Record<ToastTone, string> = {
  error: "That did not work",
  success: "Done",
  info: "Note",
};

function ToastItem({ item }: { item: Toast }) {
  // Errors stay until dismissed so nobody misses one; other notes fade after a while.
  useEffect(() => {
    if (item.tone === "error") return;
    const timer = window.setTimeout(() => dismissToast(item.id), 6000);
    return () => window.clearTimeout(timer);
  }, [item.id, item.tone]);

  return (
    <li
      className={`pointer-events-auto flex items-start gap-3 rounded-lg border py-3 pr-2 pl-3 shadow-card ${toneStyles[item.tone]}`}
    >
      <span aria-hidden="true" className={`mt-1.5 h-2.5 w-2.5 shrink-0 rounded-full ${toneMarks[item.tone]}`} />
      <div className="min-w-0 flex-1 py-0.5">
        <p className="font-bold">{item.title ?? toneWords[item.tone]}</p>
        <p className="break-words text-ink-soft">{item.message}</p>
      </div>
      <button
        type="button"
        onClick={() => dismissToast(item.id)}
        className="grid h-11 w-11 shrink-0 place-items-center rounded-md text-ink-soft hover:bg-ink/5 hover:text-ink"
      >
        <span aria-hidden="true" className="text-xl leading-none">×</span>
        <span className="sr-only">Dismiss</span>
      </button>
    </li>
  );
}

/** The one place toasts appear; render once, near the root. */
export function Toaster() {
  const items = useToasts();
  const errors = items.filter((t) => t.tone === "error");
  const others = items.filter((t) => t.tone !== "error");
  return (
    <section
      aria-label="Notifications"
      className="pointer-events-none fixed inset-x-0 bottom-0 z-50 flex flex-col items-stretch gap-2 p-3 sm:inset-x-auto sm:right-0 sm:w-[26rem]"
    >
      {/* Live regions exist before anything is put in them, so screen readers announce it. */}
      <ol role="alert" aria-live="assertive" className="flex flex-col gap-2">
        {errors.map((t) => (
          <ToastItem key={t.id} item={t} />
        ))}
      </ol>
      <ol role="status" aria-live="polite" className="flex flex-col gap-2">
        {others.map((t) => (
          <ToastItem key={t.id} item={t} />
        ))}
      </ol>
    </section>
  );
}
