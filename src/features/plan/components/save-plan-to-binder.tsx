import { useId, useState } from "react";
import { Link } from "react-router";
import { Button } from "../../../components/ui/button";
import { controlClasses } from "../../../components/ui/field";
import { errorMessage } from "../../../lib/api-client";
import { useSavePlan } from "../api/binder-plans";

type SavePlanToBinderProps = {
  ids: readonly number[];
  /** The member's binders; null for a visitor. */
  binders: { id: number; name: string }[] | null;
  signInHref: string;
};

/** Keeps the plan in one of my binders as a planned strip. */
export function SavePlanToBinder({ ids, binders, signInHref }: SavePlanToBinderProps) {
  const id = useId();
  const save = useSavePlan();
  const [chosen, setChosen] = useState<number | null>(null);
  const [savedTo, setSavedTo] = useState<{ id: number; name: string } | null>(null);
  if (binders === null)
    return (
      <p className="text-sm text-ink-soft">
        <Link to={signInHref} className="font-bold text-accent underline">
          Sign in
        </Link>{" "}
        to keep this plan in a binder.
      </p>
    );
  if (!binders.length)
    return (
      <p className="text-sm text-ink-soft">
        Make a binder on the{" "}
        <Link to="/binders" className="font-bold text-accent underline">
          binders page
        </Link>{" "}
        to keep plans in it.
      </p>
    );
  const binderId = chosen ?? binders[0]!.id;
  return (
    <div className="flex flex-col gap-2">
      <label htmlFor={id} className="font-bold">
        Keep this plan in a binder
      </label>
      <select id={id} className={controlClasses} value={binderId} onChange={(e) => setChosen(Number(e.target.value))}>
        {binders.map((b) => (
          <option key={b.id} value={b.id}>
            {b.name}
          </option>
        ))}
      </select>
      <Button
        variant="secondary"
        busy={save.isPending}
        busyLabel="Saving…"
        onClick={() => {
          const binder = binders.find((b) => b.id === binderId)!;
          save.mutate({ binderId, inks: [...ids] }, { onSuccess: () => setSavedTo(binder) });
        }}
      >
        Save as a planned strip
      </Button>
      <p role="status" className="text-sm text-ink-soft">
        {save.isError ? (
          `Not saved: ${errorMessage(save.error)}`
        ) : savedTo && !save.isPending ? (
          <>
            Saved in{" "}
            <Link to={`/binders/${savedTo.id}`} className="font-bold text-accent underline">
              {savedTo.name}
            </Link>
            .
          </>
        ) : null}
      </p>
    </div>
  );
}
