import { forwardRef, useId } from "react";
import { Link } from "react-router";
import { actionFrom, actionLabels, decisionActions, type DecisionAction, type ReviewQueueItem } from "../../../../shared/schemas/moderation";
import { statusLabels, type StripImages } from "../../../../shared/schemas/strips";
import { Badge } from "../../../components/ui/badge";
import { Button } from "../../../components/ui/button";
import { Notice } from "../../../components/ui/notice";
import { plural } from "../../../lib/format";
import type { BulkResult } from "../api/decide-strips";
import { queueShortcuts } from "../queue-keys";
import { agoWords, queueReasonText, waitingWords, withoutReloadHint } from "../review-words";
import { BandChecks, InkOrderList } from "./band-checks";
import { DecisionForm, actionVariant } from "./decision-form";
import { InkTagsEditor, type InkSearchSlot } from "./ink-tags-editor";
import { QueueBandBar } from "./queue-band-bar";

/** What is open under a row: a decision form for one action, or the ink tags editor. */
export type OpenPanel = { kind: "decide"; action: DecisionAction; version: number } | { kind: "inks"; version: number };

type ReviewItemProps = {
  item: ReviewQueueItem;
  now: number;
  current: boolean;
  selected: boolean;
  onSelect: (selected: boolean) => void;
  panel: OpenPanel | null;
  onOpen: (panel: OpenPanel) => void;
  onClose: () => void;
  /** Called after this row's strip was decided or re-tagged (the page may refresh other views). */
  onChanged: (stripId: number) => void;
  onFocusWithin: () => void;
  bulkResult?: BulkResult;
  inkSearch?: InkSearchSlot;
};

const THUMB_LONG = 480;

function photoSrcSet(images: StripImages): string | undefined {
  if (!images.width || !images.height) return undefined;
  const share = images.width >= images.height ? 1 : images.width / images.height;
  const long = Math.max(images.width, images.height);
  return `${images.thumb} ${Math.round(Math.min(THUMB_LONG, long) * share)}w, ${images.display} ${images.width}w`;
}

const keyFor = (action: DecisionAction) => queueShortcuts.find((s) => s.command === action)?.key;

/** One strip waiting for a decision: why, how long, who, the photo and its bands, and the actions. */
export const ReviewItem = forwardRef<HTMLElement, ReviewItemProps>(function ReviewItem(
  { item, now, current, selected, onSelect, panel, onOpen, onClose, onChanged, onFocusWithin, bulkResult, inkSearch },
  ref,
) {
  const id = useId();
  const { strip, author } = item;
  const allowed = decisionActions.filter((a) => actionFrom[a].includes(strip.status));
  const inkNames = strip.inks.map((i) => i.name).join(", ");

  return (
    <article
      ref={ref}
      tabIndex={-1}
      aria-labelledby={`${id}-title`}
      aria-current={current || undefined}
      onFocus={onFocusWithin}
      className={`flex scroll-mt-20 flex-col sm:scroll-mt-40 gap-4 rounded-xl border bg-card p-3 shadow-card sm:p-5 ${
        current ? "border-accent ring-2 ring-accent/60" : "border-rule"
      } ${selected ? "bg-accent-soft/40" : ""}`}
    >
      <header className="flex items-start gap-2">
        <label className="-m-1 grid h-11 w-11 shrink-0 cursor-pointer place-items-center rounded-md hover:bg-paper-shade">
          <input
            type="checkbox"
            className="h-5 w-5 accent-accent"
            checked={selected}
            onChange={(e) => onSelect(e.target.checked)}
          />
          <span className="sr-only">Select “{strip.title}”</span>
        </label>
        <div className="min-w-0 flex-1 space-y-1">
          <h3 id={`${id}-title`} className="text-xl leading-tight font-bold">
            <Link to={`/strips/${strip.id}`} className="hover:underline">
              {strip.title}
            </Link>{" "}
            <span className="text-base font-normal text-ink-muted">#{strip.id}</span>
          </h3>
          <p className="flex flex-wrap items-center gap-1.5 text-sm">
            {item.reasons.map((r) => (
              <Badge key={r} tone={queueReasonText[r].urgent ? "warning" : "neutral"}>
                {queueReasonText[r].label}
              </Badge>
            ))}
            <Badge tone="accent">{item.reasons.includes("held: reports") ? "Hidden until decided" : statusLabels[strip.status]}</Badge>
            <span className="text-ink-soft">{waitingWords(item.waitingSince, now)}</span>
          </p>
        </div>
      </header>

      <p className="text-ink-soft">
        by{" "}
        <Link to={`/members/${author.id}`} className="font-bold text-ink hover:underline">
          {author.name}
        </Link>{" "}
        · {author.standing === "trusted" ? "Trusted member" : "New member"} · {plural(author.approved, "strip")} approved,{" "}
        {author.hidden} hidden ·{" "}
        <Link to={`/moderation/log?member=${author.id}`} className="font-bold text-accent underline">
          their history
        </Link>
      </p>

      <div className="grid gap-4 lg:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
        <div className="flex min-w-0 flex-col gap-2">
          <img
            src={strip.images.thumb}
            srcSet={photoSrcSet(strip.images)}
            sizes="(min-width: 40rem) 24rem, calc(100vw - 4rem)"
            width={strip.images.width || undefined}
            height={strip.images.height || undefined}
            loading="lazy"
            decoding="async"
            alt={`Photo of “${strip.title}”${inkNames ? `, tagged ${inkNames}` : ""}`}
            className={`h-auto w-auto max-w-full self-start rounded-md border border-rule bg-paper-shade object-contain ${
              strip.orientation === "vertical" ? "max-h-80" : "max-h-64"
            }`}
          />
          <QueueBandBar bands={strip.bands} orientation={strip.orientation} flagged={item.farBands} />
          <a href={strip.images.display} target="_blank" rel="noopener noreferrer" className="self-start text-sm font-bold text-accent underline">
            Full-size photo<span className="sr-only"> of “{strip.title}”</span> (opens in a new tab)
          </a>
        </div>
        <div className="flex min-w-0 flex-col gap-2">
          <h4 className="font-bold">Ink order</h4>
          <InkOrderList inks={strip.inks} />
        </div>
      </div>

      <section aria-label={`Bands of “${strip.title}”`} className="flex flex-col gap-2">
        <h4 className="font-bold">
          Bands and suggested inks
          {item.farBands.length > 0 && (
            <span className="ml-2 text-danger">
              <span aria-hidden="true">! </span>
              {plural(item.farBands.length, "band")} far from {item.farBands.length === 1 ? "its" : "their"} tagged ink
            </span>
          )}
        </h4>
        <BandChecks item={item} />
      </section>

      {item.reports.length > 0 && (
        <section aria-label="Reports" className="flex flex-col gap-1.5">
          <h4 className="font-bold">{plural(item.reports.length, "open report")}</h4>
          <ul className="flex flex-col gap-1.5">
            {item.reports.map((r, i) => (
              <li key={i} className="rounded-md border border-warn/40 bg-warn-soft/60 px-3 py-2">
                <span className="font-bold">{r.reason}</span>
                <span className="text-sm text-ink-muted"> · {agoWords(r.createdAt, now)}</span>
                {r.note && <p className="text-ink-soft">“{r.note}”</p>}
              </li>
            ))}
          </ul>
        </section>
      )}

      {item.duplicates.length > 0 && (
        <Notice tone="warning" title="Possible duplicate: the photo matches another strip">
          <ul>
            {item.duplicates.map((d) => (
              <li key={d.id}>
                <Link to={`/strips/${d.id}`}>
                  “{d.title}” #{d.id}
                </Link>{" "}
                ({statusLabels[d.status].toLowerCase()})
              </li>
            ))}
          </ul>
        </Notice>
      )}

      {bulkResult && (
        <Notice tone={bulkResult.ok ? "success" : "error"} title={bulkResult.ok ? "Decided in the bulk action" : "Not decided in the bulk action"}>
          {!bulkResult.ok && <p>{withoutReloadHint(bulkResult.error ?? "")} The row now shows the strip as it is.</p>}
        </Notice>
      )}

      <footer className="flex flex-col gap-3 border-t border-rule pt-3">
        <div className="flex flex-wrap items-center gap-2">
          {allowed.map((action) => {
            const key = keyFor(action);
            const open = panel?.kind === "decide" && panel.action === action;
            return (
              <Button
                key={action}
                variant={actionVariant[action]}
                aria-expanded={open}
                aria-keyshortcuts={key}
                onClick={() => (open ? onClose() : onOpen({ kind: "decide", action, version: strip.version }))}
              >
                {actionLabels[action]}
                {key && (
                  <kbd aria-hidden="true" className="rounded border border-current/40 px-1 font-sans text-xs opacity-80">
                    {key}
                  </kbd>
                )}
              </Button>
            );
          })}
          <Button
            variant="quiet"
            aria-expanded={panel?.kind === "inks"}
            onClick={() => (panel?.kind === "inks" ? onClose() : onOpen({ kind: "inks", version: strip.version }))}
          >
            Correct ink tags
          </Button>
          <Link to={`/moderation/log?strip=${strip.id}`} className="inline-flex min-h-11 items-center px-2 font-bold text-accent underline">
            Strip history
          </Link>
        </div>
        {panel?.kind === "decide" && (
          <DecisionForm
            key={panel.action}
            strip={strip}
            action={panel.action}
            expectedVersion={panel.version}
            onCancel={onClose}
            onLate={() => onChanged(strip.id)}
            onDone={() => {
              onClose();
              onChanged(strip.id);
            }}
          />
        )}
        {panel?.kind === "inks" && (
          <InkTagsEditor
            item={item}
            expectedVersion={panel.version}
            inkSearch={inkSearch}
            onCancel={onClose}
            onDone={() => {
              onClose();
              onChanged(strip.id);
            }}
          />
        )}
      </footer>
    </article>
  );
});
