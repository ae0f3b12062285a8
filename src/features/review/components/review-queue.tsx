import { useCallback, useEffect, useMemo, useRef, useState } from "react";
import { actionFrom, actionLabels, type ReviewQueueItem } from "../../../../shared/schemas/moderation";
import { statusLabels } from "../../../../shared/schemas/strips";
import { Button } from "../../../components/ui/button";
import { Loading } from "../../../components/ui/loading";
import { Notice } from "../../../components/ui/notice";
import { toast } from "../../../components/ui/toast";
import { errorMessage } from "../../../lib/api-client";
import { formatDateTime, plural } from "../../../lib/format";
import type { BulkResult } from "../api/decide-strips";
import { useReviewQueue } from "../api/get-review-queue";
import type { BulkAction, Picked } from "../bulk";
import { queueCommandFor } from "../queue-keys";
import { withoutReloadHint } from "../review-words";
import { useNow } from "../use-now";
import { BulkDecisionBar } from "./bulk-decision-bar";
import type { InkSearchSlot } from "./ink-tags-editor";
import { ReviewItem, type OpenPanel } from "./review-item";
import { ShortcutHelp } from "./shortcut-help";

type ReviewQueueProps = {
  /** The catalogue search for the ink tags editor (from the ink feature, given by the page). */
  inkSearch?: InkSearchSlot;
  /** After a strip was decided or re-tagged: the page may refresh its other views of it. */
  onStripChanged?: (stripId: number) => void;
};

type BulkOutcome = { action: BulkAction; results: BulkResult[]; titles: Map<number, string> };

const bulkDone: Record<BulkAction, string> = { approve: "Approved", hide: "Hid" };

function BulkSummary({ outcome, onDismiss }: { outcome: BulkOutcome; onDismiss: () => void }) {
  const ok = outcome.results.filter((r) => r.ok);
  const failed = outcome.results.filter((r) => !r.ok);
  const box = useRef<HTMLDivElement>(null);
  // The moderator acted far down the list: bring the outcome to them.
  useEffect(() => {
    box.current?.focus({ preventScroll: true });
    box.current?.scrollIntoView({ block: "center" });
  }, [outcome]);
  return (
    <div ref={box} tabIndex={-1} className="scroll-mt-20 sm:scroll-mt-40">
      <Notice
        tone={failed.length ? "warning" : "success"}
        live
        title={`${bulkDone[outcome.action]} ${ok.length} of ${plural(outcome.results.length, "selected strip")}.`}
      >
        <ul className="space-y-0.5">
          {outcome.results.map((r) => (
            <li key={r.id}>
              <span className="font-bold">“{outcome.titles.get(r.id) ?? `Strip #${r.id}`}”</span>:{" "}
              {r.ok ? `done${r.status ? ` (now ${statusLabels[r.status].toLowerCase()})` : ""}` : `not decided. ${withoutReloadHint(r.error ?? "")}`}
            </li>
          ))}
        </ul>
        <Button variant="quiet" className="mt-1 -ml-2" onClick={onDismiss}>
          Dismiss
        </Button>
      </Notice>
    </div>
  );
}

/**
 * The review queue: every strip waiting for a moderator, oldest first, with single-key
 * shortcuts (j/k to move, a/r/h/x to decide) and bulk approve/hide.
 */
export function ReviewQueue({ inkSearch, onStripChanged }: ReviewQueueProps) {
  const queue = useReviewQueue();
  const now = useNow();
  const items: ReviewQueueItem[] = useMemo(() => queue.data?.items ?? [], [queue.data]);
  const [currentId, setCurrentId] = useState<number | null>(null);
  const [open, setOpen] = useState<{ id: number; panel: OpenPanel } | null>(null);
  // The version each strip had when it was ticked: bulk decisions are about what was seen.
  const [ticked, setTicked] = useState<Map<number, number>>(() => new Map());
  const [outcome, setOutcome] = useState<BulkOutcome | null>(null);
  const rows = useRef(new Map<number, HTMLElement>());
  const followUp = useRef<{ id: number; index: number } | null>(null);

  const picked: Picked[] = items
    .filter((i) => ticked.has(i.strip.id))
    .map((i) => ({ id: i.strip.id, title: i.strip.title, status: i.strip.status, expectedVersion: ticked.get(i.strip.id)! }));
  const currentIndex = items.findIndex((i) => i.strip.id === currentId);

  const focusRow = useCallback((id: number) => {
    const el = rows.current.get(id);
    if (!el) return;
    el.focus({ preventScroll: true });
    el.scrollIntoView({ block: "start" });
  }, []);

  // After a decision the strip usually leaves the queue: carry on with the row that took its place.
  useEffect(() => {
    const next = followUp.current;
    if (!next) return;
    if (items.some((i) => i.strip.id === next.id)) {
      followUp.current = null;
      focusRow(next.id);
      return;
    }
    followUp.current = null;
    const successor = items[Math.min(next.index, items.length - 1)];
    if (successor) {
      setCurrentId(successor.strip.id);
      focusRow(successor.strip.id);
    }
  }, [items, focusRow]);

  useEffect(() => {
    const onKey = (e: KeyboardEvent) => {
      const command = queueCommandFor(e);
      if (!command || items.length === 0) return;
      e.preventDefault();
      const from = currentIndex < 0 ? -1 : currentIndex;
      if (command === "next" || command === "previous") {
        const to = from < 0 ? 0 : Math.min(items.length - 1, Math.max(0, from + (command === "next" ? 1 : -1)));
        const id = items[to].strip.id;
        setCurrentId(id);
        focusRow(id);
        return;
      }
      const item = items[from < 0 ? 0 : from];
      const { strip } = item;
      setCurrentId(strip.id);
      if (!actionFrom[command].includes(strip.status)) {
        toast.info(`“${strip.title}” is ${statusLabels[strip.status].toLowerCase()}: it cannot be given “${actionLabels[command]}” now.`);
        focusRow(strip.id);
        return;
      }
      setOpen({ id: strip.id, panel: { kind: "decide", action: command, version: strip.version } });
    };
    document.addEventListener("keydown", onKey);
    return () => document.removeEventListener("keydown", onKey);
  }, [items, currentIndex, focusRow]);

  if (queue.isPending) return <Loading label="Loading the review queue…" />;
  if (queue.isError) {
    return (
      <Notice tone="error" title="The review queue could not be loaded" live>
        <p>{errorMessage(queue.error)}</p>
        <Button variant="secondary" className="mt-3" onClick={() => void queue.refetch()}>
          Try again
        </Button>
      </Notice>
    );
  }

  return (
    <div className="flex flex-col gap-4">
      <div className="flex flex-wrap items-center gap-x-4 gap-y-2">
        <p className="text-lg">
          <span className="font-bold">{items.length === 0 ? "Nothing" : plural(items.length, "strip")}</span> waiting
        </p>
        <p className="text-sm text-ink-muted">Updated {formatDateTime(new Date(queue.dataUpdatedAt))}</p>
        <Button variant="secondary" className="ml-auto" busy={queue.isFetching} busyLabel="Refreshing…" onClick={() => void queue.refetch()}>
          Refresh
        </Button>
      </div>
      <ShortcutHelp />
      {outcome && <BulkSummary outcome={outcome} onDismiss={() => setOutcome(null)} />}
      {items.length === 0 ? (
        <Notice tone="success" title="The review queue is empty">
          <p>No strip is waiting for a decision. New members' posts, edits, holds and reports will appear here.</p>
        </Notice>
      ) : (
        <>
          <h2 className="sr-only">Strips waiting for review</h2>
          <BulkDecisionBar
            picked={picked}
            total={items.length}
            onSelectAll={(all) =>
              setTicked(all ? new Map(items.map((i) => [i.strip.id, i.strip.version])) : new Map())
            }
            onResults={(action, results, fit) => {
              setOutcome({ action, results, titles: new Map(fit.map((p) => [p.id, p.title])) });
              setTicked(new Map());
              const done = results.filter((r) => r.ok).length;
              if (done) toast.success(`${bulkDone[action]} ${plural(done, "strip")}.`);
              for (const r of results) if (r.ok) onStripChanged?.(r.id);
            }}
          />
          <ol className="flex flex-col gap-4" aria-label="Strips waiting for review">
            {items.map((item, index) => {
              const id = item.strip.id;
              return (
                <li key={id}>
                  <ReviewItem
                    ref={(el) => {
                      if (el) rows.current.set(id, el);
                      else rows.current.delete(id);
                    }}
                    item={item}
                    now={now}
                    current={id === currentId}
                    selected={ticked.has(id)}
                    onSelect={(on) =>
                      setTicked((prev) => {
                        const next = new Map(prev);
                        if (on) next.set(id, item.strip.version);
                        else next.delete(id);
                        return next;
                      })
                    }
                    panel={open?.id === id ? open.panel : null}
                    onOpen={(panel) => {
                      setCurrentId(id);
                      setOpen({ id, panel });
                    }}
                    onClose={() => {
                      setOpen(null);
                      focusRow(id);
                    }}
                    onChanged={(stripId) => {
                      followUp.current = { id: stripId, index };
                      onStripChanged?.(stripId);
                    }}
                    onFocusWithin={() => setCurrentId(id)}
                    bulkResult={outcome?.results.find((r) => r.id === id && !r.ok)}
                    inkSearch={inkSearch}
                  />
                </li>
              );
            })}
          </ol>
        </>
      )}
    </div>
  );
}
