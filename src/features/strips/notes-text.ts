/*
 * Notes are typed as text: a blank line starts a paragraph, and <b>, <i>, lists and links may be
 * used. The server cleans the HTML; it only turns blank lines into paragraphs when the notes
 * contain no tags at all, so when tags are present the paragraphs are made here before sending.
 */

const blockStart = /^<(p|ul|ol)\b/i;
const anyTag = /<\/?(p|br|strong|b|em|i|ul|ol|li|a)\b/i;

/** The notes as sent to the server. */
export function notesForServer(text: string): string {
  const trimmed = text.trim();
  if (!anyTag.test(trimmed)) return trimmed;
  return trimmed
    .split(/\n\s*\n/)
    .map((chunk) => chunk.trim())
    .filter(Boolean)
    .map((chunk) => (blockStart.test(chunk) ? chunk : `<p>${chunk.replace(/\n/g, "<br>")}</p>`))
    .join("\n");
}

const entities: Record<string, string> = { "&lt;": "<", "&gt;": ">", "&amp;": "&", "&quot;": '"', "&#39;": "'", "&#x27;": "'" };

/** The server's cleaned HTML turned back into the text a member would have typed. */
export function notesToText(html: string): string {
  let text = html
    .replace(/<p>([\s\S]*?)<\/p>/gi, (_, inner: string) => `${inner}\n\n`)
    .replace(/<br\s*\/?>/gi, "\n")
    .replace(/(<\/(ul|ol)>)\s*/gi, "$1\n\n")
    .trim();
  // Links come back with the rel/target the server adds; it adds them again on saving.
  text = text.replace(/<a\s+href="([^"]*)"[^>]*>/gi, '<a href="$1">');
  if (!/<[a-z/]/i.test(text)) text = text.replace(/&(lt|gt|amp|quot|#39|#x27);/g, (m) => entities[m] ?? m);
  return text;
}
