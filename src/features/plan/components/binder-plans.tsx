import { Link } from "react-router";
import { hexToLab } from "../../../../shared/colour";
import { Button } from "../../../components/ui/button";
import { Notice } from "../../../components/ui/notice";
import { errorMessage } from "../../../lib/api-client";
import { formatDate, formatHex } from "../../../lib/format";
import { useBinderPlans, useRemovePlan } from "../api/binder-plans";
import { BlendStrip } from "./blend-strip";

/** The planned strips kept in a binder (shown only when it has some). */
export function BinderPlans({ binderId }: { binderId: number }) {
  const plans = useBinderPlans(binderId);
  const remove = useRemovePlan(binderId);
  if (plans.isPending || (plans.isError && !plans.data)) return null;
  if (!plans.data.items.length) return null;
  return (
    <section aria-labelledby="binder-plans" className="mt-10 flex flex-col gap-4 border-t border-rule pt-6">
      <h2 id="binder-plans" className="text-2xl font-bold">
        Planned strips
      </h2>
      {remove.isError && (
        <Notice tone="error" title="Not removed" live>
          <p>{errorMessage(remove.error)}</p>
        </Notice>
      )}
      <ol className="flex flex-col gap-4">
        {plans.data.items.map((p) => (
          <li key={p.id} className="flex flex-col gap-2 rounded-lg border border-rule bg-card p-3" data-testid="binder-plan">
            <BlendStrip labs={p.inks.map((i) => hexToLab(i.hex))} label={`Planned strip: ${p.inks.map((i) => i.name).join(", then ")}`} className="h-12" />
            <p className="text-sm">
              {p.inks.map((i, n) => (
                <span key={`${i.id}-${n}`}>
                  {n > 0 && " · "}
                  <span className="font-bold">{i.name}</span> <span className="text-ink-soft">({formatHex(i.hex)})</span>
                </span>
              ))}
              {p.inks.length < p.inkIds.length && <span className="text-ink-muted"> · an ink of this plan has left the catalogue</span>}
            </p>
            <p className="flex flex-wrap items-center gap-x-4 text-sm text-ink-muted">
              Planned {formatDate(p.addedAt)}
              <Link to={`/plan?inks=${p.inkIds.join(",")}`} className="font-bold text-accent underline">
                Open the plan
              </Link>
              {plans.data.canEdit && (
                <Button variant="quiet" className="min-h-9 px-2" busy={remove.isPending && remove.variables === p.id} onClick={() => remove.mutate(p.id)}>
                  Remove
                </Button>
              )}
            </p>
          </li>
        ))}
      </ol>
    </section>
  );
}
