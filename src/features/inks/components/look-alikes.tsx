import { Link } from "react-router";
import type { Ink } from "../../../../shared/schemas/inks";
import type { LookAlike } from "../../../../shared/schemas/search";
import { Button } from "../../../components/ui/button";
import { Loading } from "../../../components/ui/loading";
import { Notice } from "../../../components/ui/notice";
import { errorMessage } from "../../../lib/api-client";
import { formatHex, formatNumber } from "../../../lib/format";
import { useLookAlikes } from "../api/get-look-alikes";
import { colourWords } from "../colour-words";
import { InkSwatch } from "./ink-swatch";
import { DiscontinuedBadge, InkTypeBadge } from "./ink-type-badge";

/** /search with one required ink: where "Strips with it" links go. */
function inkSearchHref(inkId: number): string {
  return `/search?ink=${inkId}`;
}

const deltaEText = (deltaE: number) => `ΔE2000 ${formatNumber(deltaE, 2)}`;

function OwnedMark() {
  return (
    <span className="inline-flex items-center gap-1.5 rounded-full border border-accent/30 bg-accent-soft py-0.5 pr-2.5 pl-1 text-sm font-bold text-accent-deep">
      <span aria-hidden="true" className="grid h-5 w-5 place-items-center rounded-full bg-accent text-xs text-card">
        ✓
      </span>
      In your stash
    </span>
  );
}

function LookAlikeRow({ item }: { item: LookAlike }) {
  const { ink } = item;
  return (
    <li className="flex flex-col gap-3 rounded-lg border border-rule bg-card p-3 shadow-card sm:flex-row sm:items-center sm:gap-4" data-testid="look-alike">
      <div className="flex min-w-0 flex-1 items-center gap-3">
        <InkSwatch hex={ink.hex} className="h-12 w-16" />
        <div className="min-w-0 leading-snug">
          <Link to={`/inks/${ink.id}`} className="font-bold text-accent hover:underline">
            {ink.name}
          </Link>
          <span className="block text-sm text-ink-soft">
            {ink.brand.name} · {colourWords(ink.lab)} · <span className="tabular-nums">{formatHex(ink.hex)}</span>
          </span>
          <span className="mt-1 flex flex-wrap items-center gap-1.5">
            <InkTypeBadge type={ink.type} />
            {ink.discontinued && <DiscontinuedBadge />}
            {item.owned && <OwnedMark />}
          </span>
        </div>
      </div>
      <div className="flex flex-wrap items-center gap-x-4 gap-y-2 sm:flex-nowrap">
        <p className="rounded-md bg-paper-shade px-3 py-1.5 text-center sm:w-44">
          <span className="block font-bold">{item.words}</span>
          <span className="block text-sm text-ink-soft tabular-nums">{deltaEText(item.deltaE)}</span>
        </p>
        <Link to={inkSearchHref(ink.id)} className="inline-flex min-h-11 items-center text-sm font-bold text-accent underline hover:text-accent-deep">
          Strips with it<span className="sr-only">: {ink.name}</span>
        </Link>
      </div>
    </li>
  );
}

type LookAlikesProps = {
  ink: Pick<Ink, "id" | "name">;
  /** The signed-in member, null for a visitor, undefined while not known yet. */
  viewer: { id: string } | null | undefined;
};

/**
 * Catalogue inks hard to tell from this one (ΔE2000 ≤ 5), closest first, each with the
 * difference in words and numbers; for a member, which of them are in their stash and a note
 * naming the closest one they own.
 */
export function LookAlikes({ ink, viewer }: LookAlikesProps) {
  const lookAlikes = useLookAlikes(ink.id, viewer);

  if (lookAlikes.isPending) return <Loading label="Looking for look-alikes…" />;
  if (lookAlikes.isError)
    return (
      <Notice tone="error" title="Look-alikes could not be loaded">
        <p>{errorMessage(lookAlikes.error)}</p>
        <Button variant="secondary" className="mt-3" onClick={() => void lookAlikes.refetch()}>
          Try again
        </Button>
      </Notice>
    );

  const { items, maxDeltaE, scale, ownedLookAlike } = lookAlikes.data;
  return (
    <div className="flex flex-col gap-4">
      {ownedLookAlike && (
        <Notice tone="success" title="You already own a look-alike">
          <p>
            <Link to={`/inks/${ownedLookAlike.ink.id}`}>{ownedLookAlike.ink.name}</Link> ({ownedLookAlike.ink.brand.name}),{" "}
            {ownedLookAlike.words} ({deltaEText(ownedLookAlike.deltaE)}). Worth a look before you buy {ink.name}.
          </p>
        </Notice>
      )}
      {items.length === 0 ? (
        <p className="text-ink-soft">
          No catalogue ink is within ΔE2000 {formatNumber(maxDeltaE, 0)} of {ink.name}.
        </p>
      ) : (
        <>
          <p className="text-ink-soft">
            {items.length === 1 ? "1 catalogue ink is" : `${items.length} catalogue inks are`} within ΔE2000{" "}
            {formatNumber(maxDeltaE, 0)} of {ink.name}, closest first.
            {ownedLookAlike === null && " None of them is in your stash."}
          </p>
          <ul className="flex flex-col gap-2" aria-label={`Look-alikes of ${ink.name}`}>
            {items.map((item) => (
              <LookAlikeRow key={item.ink.id} item={item} />
            ))}
          </ul>
        </>
      )}
      <p className="max-w-prose text-sm text-ink-muted">{scale}</p>
    </div>
  );
}
