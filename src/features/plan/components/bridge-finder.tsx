import type { ReactNode } from "react";
import { Link } from "react-router";
import { hexToLab } from "../../../../shared/colour";
import type { Bridge, BridgeInkChoice } from "../../../../shared/schemas/plan";
import { Button } from "../../../components/ui/button";
import { Loading } from "../../../components/ui/loading";
import { Notice } from "../../../components/ui/notice";
import { SegmentedChoice } from "../../../components/ui/segmented-choice";
import { errorMessage } from "../../../lib/api-client";
import { formatHex, formatNumber, plural } from "../../../lib/format";
import { useBridges } from "../api/get-bridges";
import type { BridgeRequest } from "../api/keys";
import { BlendStrip } from "./blend-strip";

type BridgeFinderProps = {
  /** The two ends' pickers (the route supplies the catalogue's ink picker). */
  ends: ReactNode;
  request: BridgeRequest | null;
  viewerId: string | null;
  signInHref: string;
  onOptions: (next: { inks: BridgeInkChoice; sameBrand: boolean }) => void;
  /** Put a bridge's inks into the plan. */
  onUse: (inkIds: number[]) => void;
};

const choices = [
  { value: "any", label: "Any ink" },
  { value: "stash", label: "Only my inks" },
  { value: "oneToBuy", label: "At most one to buy" },
] as const;

/** Where the published strips with two inks side by side are listed. */
const besideSearch = (a: number, b: number) => `/search?ink=${a}&ink=${b}&adjacent=true`;

function BridgeCard({ bridge, rank, onUse }: { bridge: Bridge; rank: number; onUse: () => void }) {
  const between = bridge.inks.slice(1, -1);
  return (
    <li className="flex flex-col gap-3 rounded-lg border border-rule bg-card p-3" data-testid="bridge">
      <h3 className="font-bold">
        Bridge {rank}: {between.map((i) => i.name).join(", then ")}
      </h3>
      <BlendStrip labs={bridge.inks.map((i) => hexToLab(i.hex))} label={`Preview: ${bridge.inks.map((i) => i.name).join(", then ")}`} className="h-14" />
      <ol className="flex flex-col gap-1 text-sm">
        {bridge.inks.map((ink, i) => (
          <li key={ink.id}>
            <span className="font-bold">{ink.name}</span> <span className="text-ink-soft">({ink.brand}, {formatHex(ink.hex)})</span>
            {bridge.toBuy?.id === ink.id && <span className="ml-1 font-bold text-warn">— to buy</span>}
            {i < bridge.steps.length && (
              <span className="block pl-4 text-ink-soft">
                ↓ {bridge.steps[i]!.words}, ΔE2000 <span className="tabular-nums">{formatNumber(bridge.steps[i]!.deltaE)}</span>
                {bridge.steps[i]!.strips > 0 && (
                  <>
                    {" · "}
                    <Link className="font-bold text-accent underline" to={besideSearch(ink.id, bridge.inks[i + 1]!.id)}>
                      {plural(bridge.steps[i]!.strips, "published strip")} with this join
                    </Link>
                  </>
                )}
              </span>
            )}
          </li>
        ))}
      </ol>
      <p className="text-sm">
        Largest step: <strong className="tabular-nums">ΔE2000 {formatNumber(bridge.maxStepDeltaE)}</strong>. No muddy join.
      </p>
      <Button variant="secondary" className="self-start" onClick={onUse}>
        Plan this strip
      </Button>
    </li>
  );
}

/** Two inks that clash → the smoothest bridges of one to three inks between them. */
export function BridgeFinder({ ends, request, viewerId, signInHref, onOptions, onUse }: BridgeFinderProps) {
  const needsSignIn = !!request && request.inks !== "any" && !viewerId;
  const bridges = useBridges(needsSignIn ? null : request, viewerId);
  const inks = request?.inks ?? "any";
  const sameBrand = request?.sameBrand ?? false;
  return (
    <div className="flex flex-col gap-4">
      <div className="grid gap-4 sm:grid-cols-2">{ends}</div>
      <div className="flex flex-wrap items-center gap-4">
        <SegmentedChoice legend="Which inks a bridge may use" caption="Inks:" options={choices} value={inks} onChange={(v) => onOptions({ inks: v, sameBrand })} />
        <label className="flex min-h-11 items-center gap-2 font-bold">
          <input type="checkbox" className="h-5 w-5" checked={sameBrand} onChange={(e) => onOptions({ inks, sameBrand: e.target.checked })} />
          Same brand only
        </label>
      </div>
      {!request ? (
        <p className="text-ink-soft">Choose the two inks that clash: the first and the last ink of the strip.</p>
      ) : needsSignIn ? (
        <Notice tone="info" title="Sign in to use your stash">
          <p>
            Bridges from the inks you own need your stash. <Link to={signInHref}>Sign in</Link>, or choose “Any ink”.
          </p>
        </Notice>
      ) : bridges.isPending ? (
        <Loading label="Looking for bridges…" />
      ) : bridges.isError ? (
        <Notice tone="error" title="The bridge finder could not answer" live>
          <p>{errorMessage(bridges.error)}</p>
          <Button variant="secondary" className="mt-3" onClick={() => void bridges.refetch()}>
            Try again
          </Button>
        </Notice>
      ) : (
        <>
          <p role="status" className="text-ink-soft" data-testid="bridge-summary">
            Straight from one to the other: {bridges.data.direct.words} (ΔE2000 {formatNumber(bridges.data.direct.deltaE)})
            {bridges.data.direct.muddy ? ", a muddy join" : ""}.{" "}
            {bridges.data.bridges.length === 0
              ? `No bridge found among ${plural(bridges.data.searched, "ink")}${inks === "stash" ? " in your stash" : ""}. Try allowing more inks.`
              : `${plural(bridges.data.bridges.length, "bridge")} found among ${plural(bridges.data.searched, "ink")}, smoothest first (the largest step as small as possible).`}
          </p>
          <ol className="grid gap-3 md:grid-cols-2">
            {bridges.data.bridges.map((b, i) => (
              <BridgeCard key={b.inks.map((x) => x.id).join("-")} bridge={b} rank={i + 1} onUse={() => onUse(b.inks.map((x) => x.id))} />
            ))}
          </ol>
        </>
      )}
    </div>
  );
}
