import { useId } from "react";
import { Link } from "react-router";
import type { StashItem } from "../../../../shared/schemas/stash";
import { Badge } from "../../../components/ui/badge";
import { Button } from "../../../components/ui/button";
import { ColourSwatch } from "../../../components/ui/colour-swatch";
import { toast } from "../../../components/ui/toast";
import { colourWords } from "../../../lib/colour-words";
import { formatHex } from "../../../lib/format";
import { useRemoveStashItem } from "../api/remove-stash-item";
import { useSetRunningLow } from "../api/set-running-low";

/** The heading of the stash's list of inks (in MyStash). */
export const STASH_INKS_TITLE_ID = "stash-inks-title";

/** One ink of the stash as a swatch with its name, colour in words and hex, and its controls. */
export function StashInkCard({ item }: { item: StashItem }) {
  const id = useId();
  const { ink } = item;
  const runningLow = useSetRunningLow();
  const remove = useRemoveStashItem();
  // Show the member's choice at once; the server's answer replaces it.
  const low = runningLow.isPending ? runningLow.variables.runningLow : item.runningLow;

  return (
    <article
      aria-labelledby={`${id}-name`}
      className={`flex h-full flex-col gap-2 rounded-lg border bg-card p-2.5 shadow-card ${low ? "border-warn/50" : "border-rule"}`}
    >
      <ColourSwatch hex={ink.hex} className="h-14 w-full" />
      <div className="min-w-0 flex-1">
        <h4 id={`${id}-name`} className="leading-snug font-bold break-words">
          <Link to={`/inks/${ink.id}`} className="text-ink hover:text-accent hover:underline">
            {ink.name}
          </Link>
        </h4>
        <p className="text-sm text-ink-soft">
          {colourWords(ink.lab)} · <span className="tabular-nums">{formatHex(ink.hex)}</span>
        </p>
        <p className="sr-only">{ink.brand.name}</p>
        <p className="mt-1 flex flex-wrap gap-1">
          {low && <Badge tone="warning">Running low</Badge>}
          {ink.discontinued && <Badge>Discontinued</Badge>}
        </p>
      </div>
      <div className="flex flex-wrap items-center justify-between gap-x-2 border-t border-rule pt-1">
        <label className="flex min-h-11 cursor-pointer items-center gap-2 text-sm font-bold">
          <input
            type="checkbox"
            className="h-5 w-5 accent-accent"
            checked={low}
            aria-label={`Running low: ${ink.name}`}
            onChange={(e) => runningLow.mutate({ inkId: ink.id, runningLow: e.target.checked })}
          />
          Running low
        </label>
        <Button
          variant="quiet"
          className="px-2 text-sm"
          busy={remove.isPending}
          busyLabel="Removing…"
          onClick={async () => {
            try {
              await remove.mutateAsync(ink.id);
            } catch {
              return; // shown as a toast by the query client
            }
            // Awaited, not a mutate callback: this card is gone once the ink is; so is its
            // button, so keyboard focus continues from the list's heading.
            document.getElementById(STASH_INKS_TITLE_ID)?.focus();
            toast.success(`${ink.name} (${ink.brand.name}) is no longer in your stash.`);
          }}
        >
          Remove<span className="sr-only"> {ink.name} from your stash</span>
        </Button>
      </div>
    </article>
  );
}
