import { queueShortcuts } from "../queue-keys";

/** The queue's keyboard shortcuts, written out on the page. */
export function ShortcutHelp() {
  return (
    <details className="rounded-lg border border-rule bg-card px-3 py-2 text-sm">
      <summary className="min-h-11 cursor-pointer content-center font-bold">Keyboard shortcuts</summary>
      <div className="pb-2">
        <ul className="grid gap-x-6 gap-y-1 sm:grid-cols-3">
          {queueShortcuts.map((s) => (
            <li key={s.key} className="flex items-center gap-2">
              <kbd className="inline-grid h-7 min-w-7 place-items-center rounded border border-rule-strong bg-paper px-1.5 font-bold">{s.key}</kbd>
              <span>{s.label}</span>
            </li>
          ))}
        </ul>
        <p className="mt-2 text-ink-muted">
          Decisions still ask for a reason before anything is saved. Shortcuts rest while you type in a box or work in a decision form;
          Escape closes the form.
        </p>
      </div>
    </details>
  );
}
