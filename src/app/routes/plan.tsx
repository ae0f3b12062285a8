import { useQueries, useQuery } from "@tanstack/react-query";
import { useCallback, useMemo } from "react";
import { Link, useLocation, useSearchParams } from "react-router";
import type { Ink } from "../../../shared/schemas/inks";
import { MAX_PLAN_INKS, MIN_PLAN_INKS } from "../../../shared/schemas/plan";
import { ColourSwatch } from "../../components/ui/colour-swatch";
import { Loading } from "../../components/ui/loading";
import { PageHeader } from "../../components/ui/page-header";
import { useMe } from "../../features/accounts/api/get-me";
import { inkQueryOptions } from "../../features/inks/api/get-ink";
import { useInksById } from "../../features/inks/api/get-inks-by-id";
import { myBindersQueryOptions } from "../../features/binders/api/get-my-binders";
import { SavePlanToBinder } from "../../features/plan/components/save-plan-to-binder";
import { Notice } from "../../components/ui/notice";
import { Button } from "../../components/ui/button";
import { errorMessage, isApiError } from "../../lib/api-client";
import { InkPicker } from "../../features/inks/components/ink-picker";
import { BlendPreview } from "../../features/plan/components/blend-preview";
import { BridgeFinder } from "../../features/plan/components/bridge-finder";
import { PlanInkOrder } from "../../features/plan/components/plan-ink-order";
import { PlanShare } from "../../features/plan/components/plan-share";
import { moveInk, noRepeatsSideBySide, parseBridgeRequest, parsePlanInks, planToParams, planWithBridge } from "../../features/plan/plan-state";
import { stashQueryOptions } from "../../features/stash/api/get-stash";

function ChosenEnd({ ink, id, onClear }: { ink: Ink | undefined; id: number | null; onClear: () => void }) {
  if (id === null) return null;
  const name = ink?.name ?? `Ink #${id}`;
  return (
    <p className="flex items-center gap-2">
      {ink && <ColourSwatch hex={ink.hex} className="h-8 w-10" />}
      <span className="min-w-0 flex-1 leading-tight">
        <span className="block font-bold">{name}</span>
        {ink && <span className="block text-sm text-ink-soft">{ink.brand.name}</span>}
      </span>
      <button type="button" onClick={onClear} className="min-h-11 rounded-md px-2 text-ink-soft hover:bg-paper-shade" aria-label={`Clear ${name}`}>
        <span aria-hidden="true" className="text-xl">×</span>
      </button>
    </p>
  );
}

export default function PlanPage() {
  const [params, setParams] = useSearchParams();
  const ids = useMemo(() => parsePlanInks(params), [params]);
  const { data: me } = useMe();
  const stash = useQuery({ ...stashQueryOptions(), enabled: !!me });
  const binders = useQuery({ ...myBindersQueryOptions(), enabled: !!me });
  const stashIds = useMemo(() => new Set((stash.data ?? []).map((i) => i.ink.id)), [stash.data]);
  const bridge = useMemo(() => parseBridgeRequest(params), [params]);
  const location = useLocation();
  const byId = useInksById([...ids, ...(bridge.from ? [bridge.from] : []), ...(bridge.to ? [bridge.to] : [])]);
  const inks = useMemo(() => ids.map((id) => byId.get(id)).filter((i): i is Ink => !!i), [ids, byId]);
  const loaded = inks.length === ids.length;
  // Inks of the address that could not be loaded: gone from the catalogue (404) or a failed request.
  const failed = useQueries({
    queries: ids.map((id) => ({ ...inkQueryOptions(id), staleTime: 5 * 60_000, meta: { errorsShownInline: true } })),
    combine: (results) => results.flatMap((r, i) => (r.isError ? [{ id: ids[i]!, error: r.error, retry: r.refetch }] : [])),
  });

  const go = useCallback(
    (next: number[]) => {
      const p = planToParams(next);
      // Other parts of the page (the bridge finder) keep their own parameters.
      for (const [k, v] of params) if (k !== "inks") p.append(k, v);
      setParams(p, { preventScrollReset: true });
    },
    [params, setParams],
  );
  const setBridge = useCallback(
    (changes: Record<string, string | null>) => {
      const p = new URLSearchParams(params);
      for (const [k, v] of Object.entries(changes)) {
        if (v === null) p.delete(k);
        else p.set(k, v);
      }
      setParams(p, { preventScrollReset: true, replace: true });
    },
    [params, setParams],
  );
  const bridgeHref = (first: Ink, second: Ink) => {
    const p = new URLSearchParams(params);
    p.set("from", String(first.id));
    p.set("to", String(second.id));
    return `/plan?${p.toString()}#bridges`;
  };

  return (
    <>
      <PageHeader
        documentTitle={inks.length ? `Plan: ${inks.map((i) => i.name).join(", ")}` : "Plan a blend"}
        title="Plan a blend"
        intro="Choose two to six inks in the order you will lay them on the strip. The preview predicts each join, warns where it will go muddy or a dark ink will take over, and the address keeps the plan so you can share it."
      />
      <div className="grid items-start gap-8 lg:grid-cols-[20rem_minmax(0,1fr)]">
        <section aria-labelledby="plan-inks" className="flex flex-col gap-4 rounded-xl border border-rule bg-card p-4 shadow-card">
          <h2 id="plan-inks" className="text-lg font-bold">
            Inks, in order
          </h2>
          <InkPicker
            label="Add an ink"
            hint={me ? "Inks in your stash come first." : "Type part of an ink's name or its brand."}
            chosenIds={ids.length ? [ids[ids.length - 1]!] : []}
            chosenLabel="last in the plan"
            stashInkIds={stashIds}
            disabled={ids.length >= MAX_PLAN_INKS}
            onPick={(ink) => go([...ids, ink.id])}
          />
          {ids.length >= MAX_PLAN_INKS && <p className="text-sm text-ink-soft">A plan takes up to {MAX_PLAN_INKS} inks.</p>}
          <PlanInkOrder
            ids={ids}
            inks={byId}
            onMove={(i, step) => {
              const next = moveInk(ids, i, step);
              if (noRepeatsSideBySide(next)) go(next);
            }}
            onRemove={(i) => go(ids.filter((_, j) => j !== i))}
          />
          {ids.length >= MIN_PLAN_INKS && <PlanShare ids={ids} />}
          {ids.length >= MIN_PLAN_INKS && (
            <SavePlanToBinder
              ids={ids}
              binders={me ? (binders.data ?? []).map((b) => ({ id: b.id, name: b.name })) : null}
              signInHref={`/sign-in?next=${encodeURIComponent(`${location.pathname}${location.search}`)}`}
            />
          )}
        </section>

        <section aria-labelledby="plan-preview" className="flex min-w-0 flex-col gap-4">
          <h2 id="plan-preview" className="text-xl font-bold">
            Blend preview
          </h2>
          {ids.length < MIN_PLAN_INKS ? (
            <p className="text-ink-soft">
              Add {ids.length === 0 ? "two inks" : "one more ink"} to see the strip. Not sure where to start? Pick an ink and
              see <Link to="/inks">what others blend next to it</Link> on its page.
            </p>
          ) : failed.length > 0 ? (
            <Notice tone="error" title="This plan could not be shown" live>
              {failed.map((f) => (
                <p key={f.id}>
                  {isApiError(f.error) && f.error.status === 404 ? `Ink #${f.id} is not in the catalogue.` : `Ink #${f.id} could not be loaded: ${errorMessage(f.error)}`}
                </p>
              ))}
              <div className="mt-3 flex flex-wrap gap-2">
                <Button variant="secondary" onClick={() => go(ids.filter((id) => !failed.some((f) => f.id === id)))}>
                  Leave {failed.length === 1 ? "it" : "them"} out
                </Button>
                <Button variant="quiet" onClick={() => failed.forEach((f) => void f.retry())}>
                  Try again
                </Button>
              </div>
            </Notice>
          ) : !loaded ? (
            <Loading label="Loading the inks…" />
          ) : (
            <BlendPreview inks={inks} bridgeHref={bridgeHref} />
          )}
        </section>
      </div>

      <section id="bridges" aria-labelledby="bridges-title" className="mt-10 flex scroll-mt-24 flex-col gap-4 border-t border-rule pt-6">
        <div>
          <h2 id="bridges-title" className="text-2xl font-bold">
            Bridge finder
          </h2>
          <p className="max-w-prose text-ink-soft">
            Two inks that clash can still share a strip with “middle” inks between them. The finder tries every ink in the
            catalogue as one, two or three inks between them, leaves out every muddy join, and ranks the bridges by their
            largest step.
          </p>
        </div>
        <BridgeFinder
          viewerId={me?.id ?? null}
          signInHref={`/sign-in?next=${encodeURIComponent(`${location.pathname}${location.search}`)}`}
          request={bridge.request}
          onOptions={(o) => setBridge({ bridgeInks: o.inks === "any" ? null : o.inks, sameBrand: o.sameBrand ? "true" : null })}
          onUse={(bridgeIds) => {
            const next = planWithBridge(ids, bridgeIds).slice(0, MAX_PLAN_INKS);
            const p = planToParams(next);
            for (const [k, v] of params) if (k !== "inks") p.append(k, v);
            setParams(p);
            window.scrollTo({ top: 0 });
          }}
          ends={
            <>
              <div className="flex flex-col gap-2">
                <InkPicker label="From (first ink)" hint="" stashInkIds={stashIds} chosenIds={bridge.to ? [bridge.to] : []} chosenLabel="the other end" onPick={(ink) => setBridge({ from: String(ink.id) })} />
                <ChosenEnd id={bridge.from} ink={bridge.from ? byId.get(bridge.from) : undefined} onClear={() => setBridge({ from: null })} />
              </div>
              <div className="flex flex-col gap-2">
                <InkPicker label="To (last ink)" hint="" stashInkIds={stashIds} chosenIds={bridge.from ? [bridge.from] : []} chosenLabel="the other end" onPick={(ink) => setBridge({ to: String(ink.id) })} />
                <ChosenEnd id={bridge.to} ink={bridge.to ? byId.get(bridge.to) : undefined} onClear={() => setBridge({ to: null })} />
              </div>
            </>
          }
        />
      </section>
    </>
  );
}
