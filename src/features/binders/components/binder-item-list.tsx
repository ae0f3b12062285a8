import { useEffect, useId, useRef, useState, type DragEvent } from "react";
import type { Binder, BinderItem } from "../../../../shared/schemas/binders";
import { Button } from "../../../components/ui/button";
import { ConfirmDialog } from "../../../components/ui/confirm-dialog";
import { toast } from "../../../components/ui/toast";
import { formatDate } from "../../../lib/format";
import { useRemoveBinderItem } from "../api/remove-binder-item";
import { useReorderBinderItems } from "../api/reorder-binder-items";
import { moveItem, sameOrder } from "../move-item";
import { BinderItemNote } from "./binder-item-note";
import { BinderStrip } from "./binder-strip";

/** The binder page's title (in BinderDetail). */
export const BINDER_TITLE_ID = "binder-title";

const itemName = (item: BinderItem) => (item.available ? item.strip.title : "a strip no longer available");

type Direction = "up" | "down";

/**
 * A binder's strips in the member's order. The owner reorders by dragging the grip or with the
 * Move up / Move down buttons (the keyboard way), edits each note and removes strips.
 */
export function BinderItemList({ binder }: { binder: Binder }) {
  const id = useId();
  const reorder = useReorderBinderItems(binder.id);
  const remove = useRemoveBinderItem();
  const [announcement, setAnnouncement] = useState("");
  const [dragId, setDragId] = useState<number | null>(null);
  // Also kept outside state: a quick drop can arrive before the last render.
  const dragging = useRef<number | null>(null);
  const [dropIndex, setDropIndex] = useState<number | null>(null);
  const [removing, setRemoving] = useState<BinderItem | null>(null);
  const focusAfterMove = useRef<{ stripId: number; direction: Direction } | null>(null);
  const items = binder.items;
  const ids = items.map((i) => i.stripId);
  const owner = binder.isOwner;

  // A moved row is re-placed in the page, which can drop keyboard focus: put it back on the row's
  // button, or on the other one when the row reached an end.
  useEffect(() => {
    const want = focusAfterMove.current;
    if (!want) return;
    focusAfterMove.current = null;
    const other: Direction = want.direction === "up" ? "down" : "up";
    const first = document.getElementById(`${id}-${want.stripId}-${want.direction}`) as HTMLButtonElement | null;
    const target = first && !first.disabled ? first : (document.getElementById(`${id}-${want.stripId}-${other}`) as HTMLButtonElement | null);
    target?.focus();
  }, [items, id]);

  function commit(order: number[], moved: BinderItem) {
    if (sameOrder(order, ids)) return;
    reorder.mutate(order);
    setAnnouncement(`“${itemName(moved)}” moved to position ${order.indexOf(moved.stripId) + 1} of ${order.length}.`);
  }

  function move(index: number, direction: Direction) {
    const item = items[index];
    if (!item) return;
    focusAfterMove.current = { stripId: item.stripId, direction };
    commit(moveItem(ids, index, direction === "up" ? index - 1 : index + 1), item);
  }

  /** The gap a pointer over row `index` points at: before the row (upper half) or after it. */
  function slotAt(e: DragEvent<HTMLLIElement>, index: number): number {
    const box = e.currentTarget.getBoundingClientRect();
    return e.clientY < box.top + box.height / 2 ? index : index + 1;
  }

  function onDragOver(e: DragEvent<HTMLLIElement>, index: number) {
    if (dragging.current === null) return;
    e.preventDefault();
    e.dataTransfer.dropEffect = "move";
    const slot = slotAt(e, index);
    if (slot !== dropIndex) setDropIndex(slot);
  }

  /** Drops the dragged row into gap `slot` (0 = before the first row, length = after the last). */
  function drop(e: DragEvent, slot: number | null) {
    e.preventDefault();
    e.stopPropagation();
    const draggedId = dragging.current;
    endDrag();
    if (draggedId === null || slot === null) return;
    const from = ids.indexOf(draggedId);
    const moved = items[from];
    // The slot counts the row being dragged; once it is lifted out, later slots shift up by one.
    const to = slot > from ? slot - 1 : slot;
    if (moved) commit(moveItem(ids, from, to), moved);
  }

  function endDrag() {
    dragging.current = null;
    setDragId(null);
    setDropIndex(null);
  }

  async function confirmRemove() {
    if (!removing) return;
    const item = removing;
    try {
      await remove.mutateAsync({ binderId: binder.id, stripId: item.stripId });
    } catch {
      setRemoving(null);
      return; // shown as a toast by the query client
    }
    setRemoving(null);
    toast.success(`Removed “${itemName(item)}” from “${binder.name}”.`);
    // Its row (and the button that asked) is gone: continue from the binder's title.
    window.setTimeout(() => document.getElementById(BINDER_TITLE_ID)?.focus(), 0);
  }

  return (
    <>
      {owner && items.length > 1 && (
        <p id={`${id}-how`} className="text-sm text-ink-soft">
          {/* Touch screens do not drag and drop: the buttons are the way there. */}
          <span className="pointer-coarse:hidden">Drag a strip by its handle, or use its ↑ and ↓ buttons, to change the order.</span>
          <span className="pointer-fine:hidden">Use the ↑ and ↓ buttons on each strip to change the order.</span> The order is
          saved as you go.
        </p>
      )}
      <p role="status" className="sr-only">
        {announcement}
      </p>
      <ol
        aria-label={`Strips in ${binder.name}`}
        className="flex flex-col gap-5"
        onDragOver={(e) => dragging.current !== null && e.preventDefault()}
        onDrop={(e) => drop(e, dropIndex)}
      >
        {items.map((item, index) => {
          const name = itemName(item);
          const isDragged = dragId === item.stripId;
          return (
            <li
              key={item.stripId}
              className="relative"
              data-testid="binder-item"
              onDragOver={owner ? (e) => onDragOver(e, index) : undefined}
              onDrop={owner ? (e) => drop(e, slotAt(e, index)) : undefined}
            >
              {dropIndex === index && <span aria-hidden="true" className="absolute -top-3.5 right-0 left-0 h-1 rounded-full bg-accent" />}
              {dropIndex === items.length && index === items.length - 1 && (
                <span aria-hidden="true" className="absolute right-0 -bottom-3.5 left-0 h-1 rounded-full bg-accent" />
              )}
              <article
                aria-label={`${index + 1}. ${name}`}
                id={`${id}-item-${item.stripId}`}
                className={`flex flex-col gap-3 rounded-xl border bg-card p-2.5 shadow-card sm:p-3 ${
                  item.available ? "border-rule" : "border-dashed border-rule-strong bg-paper"
                } ${isDragged ? "opacity-50" : ""}`}
              >
                {owner && (
                  <div className="flex flex-wrap items-center justify-between gap-2 border-b border-rule pb-2">
                    <div className="flex items-center gap-2">
                      <span
                        aria-hidden="true"
                        draggable
                        title="Drag to change the order"
                        onDragStart={(e) => {
                          e.dataTransfer.effectAllowed = "move";
                          e.dataTransfer.setData("text/plain", String(item.stripId));
                          const card = document.getElementById(`${id}-item-${item.stripId}`);
                          if (card) e.dataTransfer.setDragImage(card, 24, 24);
                          dragging.current = item.stripId;
                          setDragId(item.stripId);
                        }}
                        onDragEnd={endDrag}
                        className="grid h-11 w-11 cursor-grab place-items-center pointer-coarse:hidden rounded-md border border-rule-strong bg-paper text-xl text-ink-soft select-none hover:bg-paper-shade active:cursor-grabbing"
                      >
                        ⠿
                      </span>
                      <span className="text-sm font-bold text-ink-soft tabular-nums">
                        {index + 1} of {items.length}
                      </span>
                    </div>
                    <div className="flex flex-wrap gap-1.5">
                      <Button
                        id={`${id}-${item.stripId}-up`}
                        variant="secondary"
                        className="min-h-11 px-3 text-sm"
                        disabled={index === 0}
                        aria-label={`Move up: ${name}`}
                        onClick={() => move(index, "up")}
                      >
                        <span aria-hidden="true">↑</span>
                        <span className="sm:hidden">Up</span>
                        <span className="max-sm:hidden">Move up</span>
                      </Button>
                      <Button
                        id={`${id}-${item.stripId}-down`}
                        variant="secondary"
                        className="min-h-11 px-3 text-sm"
                        disabled={index === items.length - 1}
                        aria-label={`Move down: ${name}`}
                        onClick={() => move(index, "down")}
                      >
                        <span aria-hidden="true">↓</span>
                        <span className="sm:hidden">Down</span>
                        <span className="max-sm:hidden">Move down</span>
                      </Button>
                      <Button variant="secondary" className="min-h-11 px-3 text-sm" aria-label={`Remove: ${name}`} onClick={() => setRemoving(item)}>
                        Remove
                      </Button>
                    </div>
                  </div>
                )}
                {item.available ? (
                  <BinderStrip strip={item.strip} eager={index < 2} />
                ) : (
                  <div className="flex flex-col gap-1 px-1">
                    <p className="font-bold">This strip is no longer available</p>
                    <p className="text-sm text-ink-soft">
                      It was hidden or taken down after you saved it. Only you see it here; you can remove it.
                    </p>
                  </div>
                )}
                <div className="flex flex-col gap-1 px-1">
                  <BinderItemNote binderId={binder.id} stripId={item.stripId} note={item.note} isOwner={owner} stripName={name} />
                  {owner && (
                    <p className="text-xs text-ink-muted">
                      Saved <time dateTime={item.addedAt}>{formatDate(item.addedAt)}</time>
                    </p>
                  )}
                </div>
              </article>
            </li>
          );
        })}
      </ol>
      <ConfirmDialog
        open={removing !== null}
        title="Remove this strip from the binder?"
        confirmLabel="Remove strip"
        busyLabel="Removing…"
        busy={remove.isPending}
        onCancel={() => setRemoving(null)}
        onConfirm={() => void confirmRemove()}
      >
        <p>
          “{removing ? itemName(removing) : ""}” leaves “{binder.name}”{removing?.note ? ", with your note on it" : ""}. The strip
          stays in the gallery.
        </p>
      </ConfirmDialog>
    </>
  );
}
