import { Fragment } from "react";

const URL_RE = /https?:\/\/[^\s<>"')\]]+/g;

/** Plain text with its http(s) addresses made clickable; nothing else is interpreted. */
export function LinkedText({ text }: { text: string }) {
  const parts: (string | { href: string })[] = [];
  let last = 0;
  for (const match of text.matchAll(URL_RE)) {
    const start = match.index ?? 0;
    // A sentence's full stop or comma is not part of the address.
    const href = match[0].replace(/[.,;:!?]+$/, "");
    if (start > last) parts.push(text.slice(last, start));
    parts.push({ href });
    last = start + href.length;
  }
  if (last < text.length) parts.push(text.slice(last));

  return (
    <>
      {parts.map((part, i) =>
        typeof part === "string" ? (
          <Fragment key={i}>{part}</Fragment>
        ) : (
          <a key={i} href={part.href} className="font-bold break-all text-accent underline">
            {part.href}
          </a>
        ),
      )}
    </>
  );
}
