import type { Ink } from "../../../shared/schemas/inks";
import type { StashImportPreview, StashImportRow, StashItem } from "../../../shared/schemas/stash";

/** For each ambiguous row (by its line in the file): the candidate ink the member chose, if any. */
export type ImportPicks = Readonly<Record<number, number | undefined>>;

/** The ink a row stands for once the member has looked: matched, picked, or none (skipped). */
export function chosenInk(row: StashImportRow, picks: ImportPicks): Ink | null {
  if (row.status === "matched") return row.ink;
  if (row.status === "ambiguous") {
    const pick = picks[row.line];
    return row.candidates.find((c) => c.id === pick) ?? null;
  }
  return null;
}

export type ImportPlan = {
  /** The whole stash to send: what is there now, then the new inks. */
  items: { inkId: number; runningLow: boolean }[];
  /** Inks the import adds. */
  added: Ink[];
  /** Rows naming an ink already in the stash (or named twice in the file): nothing changes for them. */
  alreadyHeld: number;
  /** Ambiguous rows still without a choice, and rows that matched nothing: left out. */
  skipped: number;
};

/**
 * What "Add these inks to my stash" will save. Inks already in the stash keep their running-low
 * flag; a new ink named on several rows is running low if any of them says so.
 */
export function importPlan(current: readonly StashItem[], preview: StashImportPreview, picks: ImportPicks): ImportPlan {
  const items = current.map((i) => ({ inkId: i.ink.id, runningLow: i.runningLow }));
  const held = new Set(items.map((i) => i.inkId));
  const fresh = new Map<number, { ink: Ink; runningLow: boolean }>();
  let alreadyHeld = 0;
  let skipped = 0;
  for (const row of preview.rows) {
    const ink = chosenInk(row, picks);
    if (!ink) {
      skipped++;
      continue;
    }
    if (held.has(ink.id)) {
      alreadyHeld++;
      continue;
    }
    const known = fresh.get(ink.id);
    if (known) {
      alreadyHeld++;
      known.runningLow ||= row.runningLow;
    } else {
      fresh.set(ink.id, { ink, runningLow: row.runningLow });
    }
  }
  for (const [inkId, { runningLow }] of fresh) items.push({ inkId, runningLow });
  return { items, added: [...fresh.values()].map((f) => f.ink), alreadyHeld, skipped };
}

/** The stash grouped by brand, keeping the server's order (brand, then ink name). */
export function groupByBrand(items: readonly StashItem[]): { brand: Ink["brand"]; items: StashItem[] }[] {
  const groups = new Map<number, { brand: Ink["brand"]; items: StashItem[] }>();
  for (const item of items) {
    const group = groups.get(item.ink.brand.id);
    if (group) group.items.push(item);
    else groups.set(item.ink.brand.id, { brand: item.ink.brand, items: [item] });
  }
  return [...groups.values()];
}
