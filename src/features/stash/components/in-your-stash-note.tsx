import { useStash } from "../api/get-stash";

/**
 * "In your stash" (and "running low") for an ink page. Renders nothing for visitors, for inks the
 * member does not own, and while the stash loads or if it cannot be read.
 */
export function InYourStashNote({ inkId }: { inkId: number }) {
  const stash = useStash();
  const item = stash.data?.find((i) => i.ink.id === inkId);
  if (!item) return null;
  return (
    <p className="inline-flex flex-wrap items-center gap-x-2 gap-y-1 rounded-full border border-accent/30 bg-accent-soft py-1 pr-3 pl-2 text-sm font-bold text-accent-deep">
      <span aria-hidden="true" className="grid h-5 w-5 place-items-center rounded-full bg-accent text-xs text-card">
        ✓
      </span>
      In your stash
      {item.runningLow && <span className="rounded-full bg-warn-soft px-2 text-warn">running low</span>}
    </p>
  );
}
