/**
 * The member's notes. The server cleans them with sanitize-html (paragraphs, line breaks, bold,
 * italic, lists and http/https/mailto links only), so this is the one place HTML is put in as is.
 */
export function StripNotes({ html }: { html: string }) {
  if (!html.trim()) return <p className="text-ink-muted">No notes.</p>;
  return <div className="prose-notes" data-testid="strip-notes" dangerouslySetInnerHTML={{ __html: html }} />;
}
