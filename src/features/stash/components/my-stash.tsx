import { useId, useState, type ReactNode } from "react";
import type { Ink } from "../../../../shared/schemas/inks";
import type { StashItem } from "../../../../shared/schemas/stash";
import { Button } from "../../../components/ui/button";
import { Card } from "../../../components/ui/card";
import { controlClasses } from "../../../components/ui/field";
import { Loading } from "../../../components/ui/loading";
import { Notice } from "../../../components/ui/notice";
import { toast } from "../../../components/ui/toast";
import { errorMessage } from "../../../lib/api-client";
import { plural } from "../../../lib/format";
import { useAddStashItem } from "../api/add-stash-item";
import { useStash } from "../api/get-stash";
import { StashByBrand } from "./stash-by-brand";
import { STASH_INKS_TITLE_ID } from "./stash-ink-card";
import { StashExportLink } from "./stash-export-link";
import { StashImport } from "./stash-import";

/** The catalogue's ink search, filled in by the route (features do not import each other). */
export type StashInkPickerSlot = (props: { onPick: (ink: Ink) => void; heldIds: ReadonlySet<number>; busy: boolean }) => ReactNode;

function matches(item: StashItem, words: string[]): boolean {
  const text = `${item.ink.name} ${item.ink.brand.name}`.toLowerCase();
  return words.every((w) => text.includes(w));
}

function StashList({ items }: { items: StashItem[] }) {
  const id = useId();
  const [filter, setFilter] = useState("");
  const [lowOnly, setLowOnly] = useState(false);
  const words = filter.toLowerCase().split(/\s+/).filter(Boolean);
  const shown = items.filter((i) => (!lowOnly || i.runningLow) && matches(i, words));
  const brands = new Set(items.map((i) => i.ink.brand.id)).size;
  const low = items.filter((i) => i.runningLow).length;

  return (
    <div className="flex flex-col gap-5">
      <p className="text-ink-soft">
        {plural(items.length, "ink")} from {plural(brands, "brand")}
        {low > 0 && `, ${low} running low`}.
      </p>
      {items.length > 8 && (
        <div className="flex flex-wrap items-end gap-x-5 gap-y-2">
          <div className="flex min-w-0 flex-1 basis-56 flex-col gap-1.5">
            <label htmlFor={`${id}-filter`} className="font-bold">
              Find in your stash
            </label>
            <input
              id={`${id}-filter`}
              type="search"
              value={filter}
              maxLength={100}
              autoComplete="off"
              onChange={(e) => setFilter(e.target.value)}
              className={controlClasses}
            />
          </div>
          <label className="flex min-h-11 items-center gap-2 font-bold">
            <input type="checkbox" className="h-5 w-5 accent-accent" checked={lowOnly} onChange={(e) => setLowOnly(e.target.checked)} />
            Running low only
          </label>
        </div>
      )}
      <p role="status" className="sr-only">
        {shown.length === items.length ? "" : `${plural(shown.length, "ink")} shown of ${items.length}.`}
      </p>
      {shown.length === 0 ? <p className="text-ink-soft">No ink in your stash matches.</p> : <StashByBrand items={shown} />}
    </div>
  );
}

/** The signed-in member's stash: add inks from the catalogue, mark them, import and export a CSV. */
export function MyStash({ inkPicker }: { inkPicker: StashInkPickerSlot }) {
  const stash = useStash();
  const add = useAddStashItem();

  if (stash.isPending) return <Loading label="Loading your stash…" />;
  if (stash.isError) {
    return (
      <Notice tone="error" title="Your stash could not be loaded" live>
        <p>{errorMessage(stash.error)}</p>
        <Button variant="secondary" className="mt-3" onClick={() => void stash.refetch()}>
          Try again
        </Button>
      </Notice>
    );
  }
  const items = stash.data ?? [];
  const heldIds = new Set(items.map((i) => i.ink.id));

  async function addInk(ink: Ink) {
    try {
      await add.mutateAsync({ inkId: ink.id });
    } catch {
      return; // shown as a toast by the query client
    }
    toast.success(`${ink.name} (${ink.brand.name}) is in your stash.`);
  }

  return (
    <div className="flex flex-col gap-10">
      <Card>
        {inkPicker({ heldIds, onPick: (ink) => void addInk(ink), busy: add.isPending })}
      </Card>

      <section aria-labelledby={STASH_INKS_TITLE_ID} className="flex flex-col gap-4">
        <h2 id={STASH_INKS_TITLE_ID} tabIndex={-1} className="text-2xl font-bold">
          Your inks
        </h2>
        {items.length === 0 ? (
          <Notice title="Your stash is empty">
            <p>Add the inks you own with the search box, or read them in from a CSV file below.</p>
          </Notice>
        ) : (
          <StashList items={items} />
        )}
      </section>

      <section aria-labelledby="stash-files-title" className="flex flex-col gap-4 border-t border-rule pt-8">
        <div className="flex flex-wrap items-end justify-between gap-3">
          <div className="space-y-1">
            <h2 id="stash-files-title" className="text-2xl font-bold">
              Import and export
            </h2>
            <p className="max-w-prose text-ink-soft">
              Bring in a list of inks from a CSV file: you see what each row matched before anything is saved. Or download
              your stash in the same layout.
            </p>
          </div>
          {items.length > 0 && <StashExportLink />}
        </div>
        <StashImport current={items} />
      </section>
    </div>
  );
}
