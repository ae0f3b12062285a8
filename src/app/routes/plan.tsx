import { useQuery } from "@tanstack/react-query";
import { useCallback, useMemo } from "react";
import { Link, useSearchParams } from "react-router";
import type { Ink } from "../../../shared/schemas/inks";
import { MAX_PLAN_INKS, MIN_PLAN_INKS } from "../../../shared/schemas/plan";
import { Loading } from "../../components/ui/loading";
import { PageHeader } from "../../components/ui/page-header";
import { useMe } from "../../features/accounts/api/get-me";
import { useInksById } from "../../features/inks/api/get-inks-by-id";
import { InkPicker } from "../../features/inks/components/ink-picker";
import { BlendPreview } from "../../features/plan/components/blend-preview";
import { PlanInkOrder } from "../../features/plan/components/plan-ink-order";
import { PlanShare } from "../../features/plan/components/plan-share";
import { moveInk, noRepeatsSideBySide, parsePlanInks, planToParams } from "../../features/plan/plan-state";
import { stashQueryOptions } from "../../features/stash/api/get-stash";

export default function PlanPage() {
  const [params, setParams] = useSearchParams();
  const ids = useMemo(() => parsePlanInks(params), [params]);
  const { data: me } = useMe();
  const stash = useQuery({ ...stashQueryOptions(), enabled: !!me });
  const stashIds = useMemo(() => new Set((stash.data ?? []).map((i) => i.ink.id)), [stash.data]);
  const byId = useInksById(ids);
  const inks = ids.map((id) => byId.get(id)).filter((i): i is Ink => !!i);
  const loaded = inks.length === ids.length;

  const go = useCallback(
    (next: number[]) => {
      const p = planToParams(next);
      // Other parts of the page (the bridge finder) keep their own parameters.
      for (const [k, v] of params) if (k !== "inks") p.append(k, v);
      setParams(p, { preventScrollReset: true });
    },
    [params, setParams],
  );

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
          ) : !loaded ? (
            <Loading label="Loading the inks…" />
          ) : (
            <BlendPreview inks={inks} />
          )}
        </section>
      </div>
    </>
  );
}
