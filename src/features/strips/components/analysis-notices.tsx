import type { AnalysisNotice } from "../../../../shared/schemas/uploads";
import { Notice } from "../../../components/ui/notice";

type AnalysisNoticesProps = {
  /** About the whole photo. */
  photo: AnalysisNotice[];
  /** About each strip, in reading order. */
  strips: { notices: AnalysisNotice[] }[];
  /** The paper white was not found (an analysis from before notices existed says so only here). */
  paperMissing?: boolean;
};

/** What the member can do about each kind of notice (matched on words in its code). */
const tips: [RegExp, string][] = [
  [/paper|white|balanced/, "Tap a clean patch of white paper on the photo (Paper white, above) if the colours look off."],
  [/small|far/, "Move the phone closer, or drag the strip's corners onto its edges."],
  [/blur|sharp|focus/, "Hold the phone still, or rest it on something, and photograph again."],
  [/dark|exposure|shadow|light/, "Photograph in daylight or under a daylight lamp, without shadows over the card."],
  [/glare|shine|reflect/, "Tilt the card a little away from the light so it does not shine, and photograph again."],
  [/touch|merge|overlap|several/, "Leave a finger's width between strips, or drag each strip's corners onto its own edges."],
  [/outline|edge|corner|angle/, "Drag the strip's corners onto its edges; we read it again when you let go."],
];

export function noticeTip(code: string): string {
  return tips.find(([re]) => re.test(code))?.[1] ?? "If this strip looks wrong, drag its corners onto its edges, or photograph it again.";
}

/** The analysis's notices in words, each with a tip; nothing when there are none. */
export function AnalysisNotices({ photo, strips, paperMissing = false }: AnalysisNoticesProps) {
  const items: { key: string; title: string; message: string; tip: string }[] = [];
  for (const n of photo) items.push({ key: `photo-${n.code}`, title: "About the photo", message: n.message, tip: noticeTip(n.code) });
  if (paperMissing && !photo.some((n) => /paper|white|balanced/.test(n.code))) {
    items.push({
      key: "photo-no-paper",
      title: "About the photo",
      message: "We found no white paper around the strip, so we took the photo as balanced.",
      tip: noticeTip("paper"),
    });
  }
  strips.forEach((s, i) => {
    for (const n of s.notices) items.push({ key: `strip-${i}-${n.code}`, title: `Strip ${i + 1}`, message: n.message, tip: noticeTip(n.code) });
  });
  if (!items.length) return null;
  return (
    <ul className="flex flex-col gap-2" aria-label="What to know about this reading" data-testid="analysis-notices">
      {items.map((item) => (
        <li key={item.key}>
          <Notice tone="warning" title={item.title}>
            <p>
              {item.message} <span className="text-ink">{item.tip}</span>
            </p>
          </Notice>
        </li>
      ))}
    </ul>
  );
}
