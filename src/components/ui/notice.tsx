import type { ReactNode } from "react";

export type NoticeTone = "error" | "success" | "info" | "warning";

const tones: Record<NoticeTone, string> = {
  error: "border-danger/40 bg-danger-soft",
  success: "border-success/40 bg-success-soft",
  info: "border-rule bg-paper-shade",
  warning: "border-warn/40 bg-warn-soft",
};

const marks: Record<NoticeTone, string> = {
  error: "bg-danger",
  success: "bg-success",
  info: "bg-accent",
  warning: "bg-warn",
};

type NoticeProps = {
  tone?: NoticeTone;
  title?: ReactNode;
  children?: ReactNode;
  /** Announce on appearance: use for errors that arrive after an action. */
  live?: boolean;
  className?: string;
};

/** A calm inline message box for errors, confirmations and explanations. */
export function Notice({ tone = "info", title, children, live = false, className = "" }: NoticeProps) {
  return (
    <div
      role={live ? (tone === "error" ? "alert" : "status") : undefined}
      className={`flex gap-3 rounded-lg border p-4 ${tones[tone]} ${className}`}
    >
      <span aria-hidden="true" className={`mt-1.5 h-2.5 w-2.5 shrink-0 rounded-full ${marks[tone]}`} />
      <div className="min-w-0 flex-1 space-y-1">
        {title && <p className="font-bold">{title}</p>}
        {children && <div className="text-ink-soft [&_a]:font-bold [&_a]:text-accent [&_a]:underline">{children}</div>}
      </div>
    </div>
  );
}

/** The error summary above a form: the server's message and any problems not tied to an input. */
export function FormAlert({ message, details = [] }: { message?: string | null; details?: string[] }) {
  if (!message && details.length === 0) return null;
  return (
    <Notice tone="error" title={message ?? "Please check the form."} live>
      {details.length > 0 && (
        <ul className="list-disc space-y-0.5 pl-5">
          {details.map((d) => (
            <li key={d}>{d}</li>
          ))}
        </ul>
      )}
    </Notice>
  );
}
