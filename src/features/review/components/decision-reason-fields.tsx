import type { UseFormRegisterReturn } from "react-hook-form";
import { decisionReasons, type DecisionAction } from "../../../../shared/schemas/moderation";
import { Field, SelectInput, TextArea } from "../../../components/ui/field";

type DecisionReasonFieldsProps = {
  action: DecisionAction;
  /** The reason chosen so far ("other" makes the note required). */
  reason: string | undefined;
  reasonField: UseFormRegisterReturn;
  noteField: UseFormRegisterReturn;
  errors: { reason?: string; note?: string };
};

/** The reason (from the action's list) and the note of a moderation decision, one strip or many. */
export function DecisionReasonFields({ action, reason, reasonField, noteField, errors }: DecisionReasonFieldsProps) {
  return (
    <div className="grid gap-3 sm:grid-cols-2">
      <Field label="Reason" error={errors.reason}>
        {(f) => (
          <SelectInput id={f.id} aria-describedby={f.describedBy} aria-invalid={f.invalid || undefined} autoFocus {...reasonField}>
            <option value="">Choose a reason…</option>
            {decisionReasons[action].map((r) => (
              <option key={r} value={r}>
                {r}
              </option>
            ))}
          </SelectInput>
        )}
      </Field>
      <Field
        label="Note"
        optional={reason !== "other"}
        hint={reason === "other" ? "Say why: the reason “other” needs a note." : undefined}
        error={errors.note}
      >
        {(f) => (
          <TextArea id={f.id} aria-describedby={f.describedBy} aria-invalid={f.invalid || undefined} rows={2} maxLength={1000} className="min-h-11" {...noteField} />
        )}
      </Field>
    </div>
  );
}
