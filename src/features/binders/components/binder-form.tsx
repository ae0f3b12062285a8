import { zodResolver } from "@hookform/resolvers/zod";
import { useId, useState } from "react";
import { useForm, useWatch } from "react-hook-form";
import type { z } from "zod";
import { binderInput, visibilities } from "../../../../shared/schemas/binders";
import { Button } from "../../../components/ui/button";
import { Field, fieldErrorText, TextArea, TextField } from "../../../components/ui/field";
import { FormAlert } from "../../../components/ui/notice";
import { errorMessage } from "../../../lib/api-client";
import { applyApiFieldErrors } from "../../../lib/form-errors";
import { visibilityHints, visibilityLabels } from "./visibility-badge";

export type BinderValues = z.output<typeof binderInput>;
type BinderFormInput = z.input<typeof binderInput>;

type BinderFormProps = {
  defaultValues?: Partial<BinderValues>;
  submitLabel: string;
  busyLabel: string;
  /** Throw to show the error; resolve when done (the form resets to what was saved). */
  onSubmit: (values: BinderValues) => Promise<void>;
  onCancel?: () => void;
  /** Focus the name on first show (a form the member just opened). */
  autoFocus?: boolean;
};

/** Name, description and who can see it: the same fields for a new binder and an edit. */
export function BinderForm({ defaultValues, submitLabel, busyLabel, onSubmit, onCancel, autoFocus = false }: BinderFormProps) {
  const id = useId();
  const [failure, setFailure] = useState<{ message: string; details: string[] } | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    reset,
    control,
    formState: { errors, isSubmitting },
  } = useForm<BinderFormInput, unknown, BinderValues>({
    resolver: zodResolver(binderInput),
    defaultValues: { name: "", description: "", visibility: "private", ...defaultValues },
  });
  const descriptionLength = (useWatch({ control, name: "description" }) ?? "").length;

  const submit = handleSubmit(async (values) => {
    setFailure(null);
    try {
      await onSubmit(values);
      reset(values);
    } catch (error) {
      const details = applyApiFieldErrors(error, setError, ["name", "description", "visibility"]);
      setFailure({ message: errorMessage(error), details });
    }
  });

  return (
    <form noValidate onSubmit={submit} className="flex flex-col gap-5">
      <FormAlert message={failure?.message} details={failure?.details} />
      <TextField
        label="Name"
        hint="Up to 80 characters, e.g. “Autumn cards”."
        error={errors.name?.message}
        maxLength={80}
        autoComplete="off"
        autoFocus={autoFocus}
        {...register("name")}
      />
      <Field
        label="Description"
        optional
        hint={`What the strips in it have in common. ${descriptionLength} of 500 characters.`}
        error={errors.description?.message}
      >
        {(f) => (
          <TextArea
            id={f.id}
            aria-describedby={f.describedBy}
            aria-invalid={f.invalid || undefined}
            maxLength={500}
            rows={3}
            className="min-h-20"
            {...register("description")}
          />
        )}
      </Field>
      <fieldset className="flex flex-col gap-2" aria-describedby={errors.visibility ? `${id}-visibility-error` : undefined}>
        <legend className="mb-1.5 font-bold">Who can see it</legend>
        {visibilities.map((v) => (
          <div key={v} className="flex items-start gap-3">
            <input
              id={`${id}-${v}`}
              type="radio"
              value={v}
              className="mt-3 h-5 w-5 shrink-0 accent-accent"
              {...register("visibility")}
            />
            <label htmlFor={`${id}-${v}`} className="flex min-h-11 flex-col justify-center py-1">
              <span className="font-bold">{visibilityLabels[v]}</span>
              <span className="text-sm text-ink-muted">{visibilityHints[v]}</span>
            </label>
          </div>
        ))}
        {errors.visibility?.message && (
          <p id={`${id}-visibility-error`} className="text-sm font-bold text-danger">
            {fieldErrorText("Visibility", errors.visibility.message)}
          </p>
        )}
      </fieldset>
      <div className="flex flex-wrap gap-3">
        <Button type="submit" busy={isSubmitting} busyLabel={busyLabel}>
          {submitLabel}
        </Button>
        {onCancel && (
          <Button variant="secondary" onClick={onCancel} disabled={isSubmitting}>
            Cancel
          </Button>
        )}
      </div>
    </form>
  );
}
