import sanitizeHtml from "sanitize-html";

/**
 * Notes allow paragraphs, line breaks, bold, italic, lists and links; everything else
 * (scripts, event handlers, styles, images, javascript: links) is removed.
 */
export function cleanNotes(input: string): string {
  const html = /<\/?(p|br|strong|b|em|i|ul|ol|li|a)\b/i.test(input) ? input : plainToParagraphs(input);
  return sanitizeHtml(html, {
    allowedTags: ["p", "br", "strong", "b", "em", "i", "ul", "ol", "li", "a"],
    allowedAttributes: { a: ["href", "rel", "target"] },
    allowedSchemes: ["http", "https", "mailto"],
    allowedSchemesAppliedToAttributes: ["href"],
    allowProtocolRelative: false,
    disallowedTagsMode: "discard",
    transformTags: {
      b: "strong",
      i: "em",
      a: sanitizeHtml.simpleTransform("a", { rel: "nofollow ugc noopener noreferrer", target: "_blank" }),
    },
    exclusiveFilter: (frame) => frame.tag === "a" && !frame.attribs.href,
  }).trim();
}

function escape(s: string) {
  return s.replace(/&/g, "&amp;").replace(/</g, "&lt;").replace(/>/g, "&gt;");
}

/** Plain text typed by a member: blank lines start paragraphs, single newlines are line breaks. */
function plainToParagraphs(text: string): string {
  return text
    .trim()
    .split(/\n\s*\n/)
    .filter((p) => p.trim())
    .map((p) => `<p>${escape(p.trim()).replace(/\n/g, "<br>")}</p>`)
    .join("");
}
