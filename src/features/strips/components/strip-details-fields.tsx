import { useId } from "react";
import type { FieldErrors, UseFormRegister } from "react-hook-form";
import type { z } from "zod";
import { MAX_NOTES, paperLabels, papers, stripInput, toolLabels, tools } from "../../../../shared/schemas/strips";
import { Checkbox, Field, fieldErrorText, SelectInput, TextArea, TextField } from "../../../components/ui/field";

/** The strip's details as the form checks them: stripInput without the upload and the ink order. */
export const stripDetailsSchema = stripInput.pick({ title: true, notes: true, paper: true, tools: true, videoUrl: true });
export type StripDetailsValues = z.input<typeof stripDetailsSchema>;
export type StripDetailsOutput = z.output<typeof stripDetailsSchema>;
export const stripDetailFieldNames = ["title", "notes", "paper", "tools", "videoUrl"] as const;

type StripDetailsFieldsProps = {
  register: UseFormRegister<StripDetailsValues>;
  errors: FieldErrors<StripDetailsValues>;
};

/** Title, notes, paper, tools and video link: the same fields when posting and when editing. */
export function StripDetailsFields({ register, errors }: StripDetailsFieldsProps) {
  const id = useId();
  const toolsError = errors.tools?.message ?? errors.tools?.root?.message;
  return (
    <div className="flex flex-col gap-6">
      <TextField
        label="Title"
        hint="A few words, e.g. “Sea to sand, soft joins”."
        error={errors.title?.message}
        autoComplete="off"
        maxLength={100}
        {...register("title")}
      />

      <Field
        label="Notes"
        optional
        hint={
          <>
            How you blended it, what you would change. A blank line starts a new paragraph. You may use{" "}
            <code className="font-bold">&lt;b&gt;</code>, <code className="font-bold">&lt;i&gt;</code>, lists (
            <code className="font-bold">&lt;ul&gt;&lt;li&gt;</code>) and links (
            <code className="font-bold">&lt;a href="https://…"&gt;</code>); anything else is removed.
          </>
        }
        error={errors.notes?.message}
      >
        {(f) => (
          <TextArea
            id={f.id}
            aria-describedby={f.describedBy}
            aria-invalid={f.invalid || undefined}
            rows={6}
            maxLength={MAX_NOTES}
            {...register("notes")}
          />
        )}
      </Field>

      <Field label="Paper" error={errors.paper?.message}>
        {(f) => (
          <SelectInput id={f.id} aria-describedby={f.describedBy} aria-invalid={f.invalid || undefined} {...register("paper")}>
            <option value="">Choose the paper…</option>
            {papers.map((p) => (
              <option key={p} value={p}>
                {paperLabels[p]}
              </option>
            ))}
          </SelectInput>
        )}
      </Field>

      <fieldset aria-describedby={toolsError ? `${id}-tools-error` : `${id}-tools-hint`}>
        <legend className="font-bold">
          Tools <span className="font-normal text-ink-muted">(optional)</span>
        </legend>
        <p id={`${id}-tools-hint`} className="text-sm text-ink-muted">
          What you blended with.
        </p>
        <div className="mt-1 grid gap-x-4 sm:grid-cols-3">
          {tools.map((t) => (
            <Checkbox key={t} label={toolLabels[t]} value={t} {...register("tools")} />
          ))}
        </div>
        {toolsError && (
          <p id={`${id}-tools-error`} className="mt-1.5 text-sm font-bold text-danger">
            ! {fieldErrorText("Tools", toolsError)}
          </p>
        )}
      </fieldset>

      <TextField
        label="Video link"
        optional
        hint="A link to a video of you blending this strip (http:// or https://)."
        error={errors.videoUrl?.message}
        type="url"
        inputMode="url"
        autoComplete="url"
        placeholder="https://"
        maxLength={500}
        {...register("videoUrl")}
      />
    </div>
  );
}
