import { zodResolver } from "@hookform/resolvers/zod";
import { useId, useState } from "react";
import { useForm, useWatch } from "react-hook-form";
import type { z } from "zod";
import { actionLabels, decisionInput, type DecisionAction } from "../../../../shared/schemas/moderation";
import { Button, type ButtonVariant } from "../../../components/ui/button";
import { FormAlert, Notice } from "../../../components/ui/notice";
import { toast } from "../../../components/ui/toast";
import { errorMessage } from "../../../lib/api-client";
import { applyApiFieldErrors } from "../../../lib/form-errors";
import { isAlreadyDecided, useDecideStrip, type DecisionResult } from "../api/decide-strip";
import { actionDone, withoutReloadHint } from "../review-words";
import { DecisionReasonFields } from "./decision-reason-fields";

export const actionVariant: Record<DecisionAction, ButtonVariant> = {
  approve: "primary",
  restore: "primary",
  return: "secondary",
  hide: "danger",
  reject: "danger",
};

const toAuthor: Record<DecisionAction, string> = {
  approve: "The author is told the strip is published. The reason is kept in the moderation log.",
  restore: "The author is told the strip is back. The reason is kept in the moderation log.",
  return: "The author is told this reason and note, and can fix the strip and send it back.",
  hide: "The author is told this reason and note.",
  reject: "The author is told this reason and note.",
};

type DecisionFormProps = {
  strip: { id: number; title: string };
  action: DecisionAction;
  /** The version the moderator was looking at when they chose the action. */
  expectedVersion: number;
  onDone: (result: DecisionResult) => void;
  onCancel: () => void;
  /** Someone else changed the strip first (the queue is being refreshed). */
  onLate?: () => void;
};

type Values = z.input<typeof decisionInput>;

/** One decision on one strip: a reason from our list and a note (needed for "other"). */
export function DecisionForm({ strip, action, expectedVersion, onDone, onCancel, onLate }: DecisionFormProps) {
  const id = useId();
  const decide = useDecideStrip();
  const [failure, setFailure] = useState<{ message: string; details: string[]; late: boolean } | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    control,
    formState: { errors, isSubmitting },
  } = useForm<Values, unknown, z.output<typeof decisionInput>>({
    resolver: zodResolver(decisionInput),
    defaultValues: { action, reason: "", note: "", expectedVersion },
  });
  const reason = useWatch({ control, name: "reason" });

  const submit = handleSubmit(async (decision) => {
    setFailure(null);
    try {
      const result = await decide.mutateAsync({ id: strip.id, decision });
      toast.success(`“${strip.title}” is ${actionDone[action]}.`);
      onDone(result);
    } catch (error) {
      if (isAlreadyDecided(error)) {
        toast.error(`${withoutReloadHint(errorMessage(error))} The queue has been refreshed.`, `Another moderator decided “${strip.title}” first`);
        setFailure({ message: errorMessage(error), details: [], late: true });
        onLate?.();
        return;
      }
      const details = applyApiFieldErrors(error, setError, ["reason", "note"]);
      setFailure({ message: errorMessage(error), details, late: false });
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
      className="flex flex-col gap-3 rounded-lg border border-rule-strong bg-card p-3 sm:p-4"
    >
      <h4 id={`${id}-title`} className="font-bold">
        {actionLabels[action]}: “{strip.title}”
      </h4>
      {failure?.late ? (
        <Notice tone="warning" title="Another moderator decided this strip first" live>
          <p>{withoutReloadHint(failure.message)} The queue shows it as it is now.</p>
        </Notice>
      ) : (
        <FormAlert message={failure?.message} details={failure?.details} />
      )}
      <DecisionReasonFields
        action={action}
        reason={reason}
        reasonField={register("reason")}
        noteField={register("note")}
        errors={{ reason: errors.reason?.message, note: errors.note?.message }}
      />
      <p className="text-sm text-ink-muted">{toAuthor[action]}</p>
      <div className="flex flex-wrap gap-2">
        <Button type="submit" variant={actionVariant[action]} busy={isSubmitting} busyLabel="Saving…" disabled={failure?.late}>
          {actionLabels[action]}
        </Button>
        <Button variant="secondary" onClick={onCancel} disabled={isSubmitting}>
          {failure?.late ? "Close" : "Cancel"}
        </Button>
      </div>
    </form>
  );
}
