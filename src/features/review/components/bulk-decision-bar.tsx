import { zodResolver } from "@hookform/resolvers/zod";
import { useEffect, useId, useRef, useState } from "react";
import { useForm, useWatch } from "react-hook-form";
import { z } from "zod";
import { actionLabels, bulkDecisionInput, decisionReasons } from "../../../../shared/schemas/moderation";
import { statusLabels } from "../../../../shared/schemas/strips";
import { Button } from "../../../components/ui/button";
import { FormAlert, Notice } from "../../../components/ui/notice";
import { errorMessage } from "../../../lib/api-client";
import { plural } from "../../../lib/format";
import { useDecideStrips, type BulkResult } from "../api/decide-strips";
import { splitForBulk, type BulkAction, type Picked } from "../bulk";
import { DecisionReasonFields } from "./decision-reason-fields";

const bulkReasonSchema = bulkDecisionInput
  .pick({ action: true, reason: true, note: true })
  .superRefine((v, ctx) => {
    if (!decisionReasons[v.action].includes(v.reason)) ctx.addIssue({ code: "custom", path: ["reason"], message: "choose a reason from the list" });
    if (v.reason === "other" && !v.note) ctx.addIssue({ code: "custom", path: ["note"], message: "say why, when the reason is \"other\"" });
  });
type BulkValues = z.input<typeof bulkReasonSchema>;

type BulkDecisionBarProps = {
  picked: Picked[];
  total: number;
  onSelectAll: (all: boolean) => void;
  onResults: (action: BulkAction, results: BulkResult[], picked: Picked[]) => void;
};

const doneWords: Record<BulkAction, string> = { approve: "approved", hide: "hidden" };

function BulkForm({ action, picked, onCancel, onResults }: { action: BulkAction; picked: Picked[]; onCancel: () => void; onResults: BulkDecisionBarProps["onResults"] }) {
  const id = useId();
  const decide = useDecideStrips();
  const [failure, setFailure] = useState<string | null>(null);
  const { fit, unfit } = splitForBulk(action, picked);
  const {
    register,
    handleSubmit,
    control,
    formState: { errors, isSubmitting },
  } = useForm<BulkValues, unknown, z.output<typeof bulkReasonSchema>>({
    resolver: zodResolver(bulkReasonSchema),
    defaultValues: { action, reason: "", note: "" },
  });
  const reason = useWatch({ control, name: "reason" });

  const submit = handleSubmit(async (values) => {
    setFailure(null);
    try {
      const { results } = await decide.mutateAsync({ ...values, items: fit.map((p) => ({ id: p.id, expectedVersion: p.expectedVersion })) });
      onResults(action, results, fit);
    } catch (error) {
      setFailure(errorMessage(error));
    }
  });

  return (
    <form
      noValidate
      onSubmit={submit}
      aria-labelledby={`${id}-title`}
      onKeyDown={(e) => {
        if (e.key === "Escape" && !isSubmitting) {
          e.stopPropagation();
          onCancel();
        }
      }}
      className="flex flex-col gap-3 border-t border-rule pt-3"
    >
      <h3 id={`${id}-title`} className="font-bold">
        {actionLabels[action]} {plural(fit.length, "selected strip")} with one reason
      </h3>
      <FormAlert message={failure} />
      {unfit.length > 0 && (
        <Notice tone="warning">
          <p>
            {plural(unfit.length, "selected strip")} cannot be {doneWords[action]} now and {unfit.length === 1 ? "is" : "are"} left out:{" "}
            {unfit.map((p) => `“${p.title}” (${statusLabels[p.status].toLowerCase()})`).join(", ")}.
          </p>
        </Notice>
      )}
      <DecisionReasonFields
        action={action}
        reason={reason}
        reasonField={register("reason")}
        noteField={register("note")}
        errors={{ reason: errors.reason?.message, note: errors.note?.message }}
      />
      <div className="flex flex-wrap gap-2">
        <Button type="submit" variant={action === "hide" ? "danger" : "primary"} busy={isSubmitting} busyLabel="Deciding…" disabled={fit.length === 0}>
          {actionLabels[action]} {plural(fit.length, "strip")}
        </Button>
        <Button variant="secondary" onClick={onCancel} disabled={isSubmitting}>
          Cancel
        </Button>
      </div>
    </form>
  );
}

/** Select strips and approve or hide them all with one reason; each strip is decided on its own. */
export function BulkDecisionBar({ picked, total, onSelectAll, onResults }: BulkDecisionBarProps) {
  const [action, setAction] = useState<BulkAction | null>(null);
  const all = useRef<HTMLInputElement>(null);
  const some = picked.length > 0 && picked.length < total;
  useEffect(() => {
    if (all.current) all.current.indeterminate = some;
  }, [some]);

  // Nothing selected: nothing to decide.
  const [wasEmpty, setWasEmpty] = useState(picked.length === 0);
  if (wasEmpty !== (picked.length === 0)) {
    setWasEmpty(picked.length === 0);
    if (picked.length === 0) setAction(null);
  }

  return (
    <div data-no-shortcuts className="z-20 flex flex-col gap-2 rounded-xl border border-rule-strong bg-card/95 p-3 shadow-card backdrop-blur sm:sticky sm:top-16">
      <div className="flex flex-wrap items-center gap-x-3 gap-y-2">
        <label className="flex min-h-11 cursor-pointer items-center gap-2 font-bold">
          <input
            ref={all}
            type="checkbox"
            className="h-5 w-5 accent-accent"
            checked={total > 0 && picked.length === total}
            disabled={total === 0}
            onChange={(e) => onSelectAll(e.target.checked)}
          />
          Select all
        </label>
        <span className="text-ink-soft" aria-live="polite">
          {picked.length === 0 ? "None selected" : `${plural(picked.length, "strip")} selected`}
        </span>
        <span className="flex flex-wrap gap-2 sm:ml-auto">
          <Button variant="secondary" disabled={picked.length === 0} aria-expanded={action === "approve"} onClick={() => setAction(action === "approve" ? null : "approve")}>
            Approve selected
          </Button>
          <Button variant="secondary" disabled={picked.length === 0} aria-expanded={action === "hide"} onClick={() => setAction(action === "hide" ? null : "hide")}>
            Hide selected
          </Button>
        </span>
      </div>
      {action && (
        <BulkForm
          key={action}
          action={action}
          picked={picked}
          onCancel={() => setAction(null)}
          onResults={(a, results, fit) => {
            setAction(null);
            onResults(a, results, fit);
          }}
        />
      )}
    </div>
  );
}
