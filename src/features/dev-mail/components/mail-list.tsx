import type { CapturedMail } from "../../../../shared/schemas/accounts";
import { formatDateTime } from "../../../lib/format";
import { LinkedText } from "./linked-text";

export function MailList({ messages }: { messages: CapturedMail[] }) {
  return (
    <ol aria-label="Captured mail, newest first" className="flex flex-col gap-4">
      {messages.map((m) => (
        <li key={m.id}>
          <article aria-labelledby={`mail-${m.id}`} className="rounded-xl border border-rule bg-card shadow-card">
            <header className="border-b border-rule px-4 py-3 sm:px-5">
              <h2 id={`mail-${m.id}`} className="text-lg font-bold">
                {m.subject || "(no subject)"}
              </h2>
              <dl className="mt-1 grid grid-cols-[3.5rem_1fr] gap-x-2 text-sm text-ink-soft">
                <dt>To</dt>
                <dd className="break-all">{m.to.join(", ")}</dd>
                <dt>From</dt>
                <dd className="break-all">{m.from}</dd>
                <dt>Sent</dt>
                <dd>
                  <time dateTime={m.date}>{formatDateTime(m.date)}</time>
                </dd>
              </dl>
            </header>
            <pre className="overflow-x-auto px-4 py-4 font-sans break-words whitespace-pre-wrap sm:px-5">
              <LinkedText text={m.text} />
            </pre>
          </article>
        </li>
      ))}
    </ol>
  );
}
