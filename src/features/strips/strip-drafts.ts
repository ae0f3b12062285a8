// One draft per strip of a several-strip photo: ticked or not, its title and ink order.
import type { StripStatus } from "../../../shared/schemas/strips";
import type { AnalysisBand, StripReading, Upload } from "../../../shared/schemas/uploads";
import { prefillInks, type InkChoice } from "./ink-choice";

export type PostedDraft = { id: number; status: StripStatus };

export type StripDraft = {
  ticked: boolean;
  title: string;
  titleTouched: boolean;
  inks: InkChoice[];
  inksTouched: boolean;
  /** The strip was read again after the member changed its ink order. */
  remeasured: boolean;
  posted?: PostedDraft;
  /** Why posting it did not work, in words. */
  problem?: string;
};

/** A title to start from: the first and last ink ("Deep Sounding to Garnet Vein"); the member can change it. */
export function titleFor(inks: InkChoice[]): string {
  if (inks.length === 0) return "";
  if (inks.length === 1) return `${inks[0]!.name} strip`;
  return `${inks[0]!.name} to ${inks[inks.length - 1]!.name}`.slice(0, 100);
}

export function draftFor(bands: AnalysisBand[]): StripDraft {
  const inks = prefillInks(bands);
  return { ticked: true, title: titleFor(inks), titleTouched: false, inks, inksTouched: false, remeasured: false };
}

/** A strip was read again: its ink order follows the new bands unless the member changed it. */
export function reread(draft: StripDraft, bands: AnalysisBand[]): StripDraft {
  if (draft.inksTouched) return { ...draft, remeasured: true };
  const inks = prefillInks(bands);
  return { ...draft, inks, title: draft.titleTouched ? draft.title : titleFor(inks), remeasured: false };
}

type Readable = Pick<StripReading, "bands"> & { outline: StripReading["outline"] | null };

const sameOutline = (a: Readable["outline"], b: Readable["outline"]) => !!a && !!b && a.every((p, k) => p[0] === b[k]![0] && p[1] === b[k]![1]);
const sameBands = (a: AnalysisBand[], b: AnalysisBand[]) => a.length === b.length && a.every((x, k) => x.hex === b[k]!.hex && x.start === b[k]!.start && x.end === b[k]!.end);

/**
 * The drafts for the photo's strips as they are now, from the drafts for how they were: a strip
 * whose outline did not move keeps its draft (found by outline, so removing a strip does not
 * shift the others' ink orders); with the same number of strips, a moved outline is the same
 * strip read again; a new strip gets a fresh draft.
 */
export function draftsFollowing(before: Readable[], drafts: StripDraft[], after: Readable[]): StripDraft[] {
  return after.map((strip, i) => {
    const k = before.findIndex((b) => sameOutline(b.outline, strip.outline));
    const kept = k >= 0 ? drafts[k] : undefined;
    if (kept) return sameBands(before[k]!.bands, strip.bands) ? kept : reread(kept, strip.bands);
    if (before.length === after.length && drafts[i]) return reread(drafts[i]!, strip.bands);
    return draftFor(strip.bands);
  });
}

/** Why a ticked draft cannot be posted yet, or null. */
export function draftProblem(draft: StripDraft): string | null {
  const title = draft.title.trim();
  if (title.length < 3) return "Give it a title of at least 3 characters.";
  if (title.length > 100) return "Keep the title to 100 characters.";
  if (draft.inks.length === 0) return "Add at least one ink to its ink order.";
  return null;
}

/** Marks the drafts of strips the server says are already posted (after a reload, or from another tab). */
export function withPosted(drafts: StripDraft[], posted: Upload["posted"]): StripDraft[] {
  if (!posted?.length) return drafts;
  return drafts.map((d, i) => {
    const p = posted.find((x) => x.stripIndex === i);
    return p ? { ...d, posted: { id: p.stripId, status: p.status }, problem: undefined } : d;
  });
}
