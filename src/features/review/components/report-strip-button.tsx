import { zodResolver } from "@hookform/resolvers/zod";
import { useId, useRef, useState } from "react";
import { useForm, useWatch } from "react-hook-form";
import type { z } from "zod";
import { reportInput, reportReasons } from "../../../../shared/schemas/moderation";
import { Button, buttonClasses } from "../../../components/ui/button";
import { Field, TextArea } from "../../../components/ui/field";
import { FormAlert, Notice } from "../../../components/ui/notice";
import { errorMessage, isApiError } from "../../../lib/api-client";
import { applyApiFieldErrors } from "../../../lib/form-errors";
import { useReportStrip, type ReportReceipt } from "../api/report-strip";

export type ReportStripButtonProps = {
  stripId: number;
  /** After a report was received (e.g. to refresh the strip, which may now be held). */
  onReported?: (receipt: ReportReceipt) => void;
};

const reasonHints: Record<(typeof reportReasons)[number], string> = {
  "not a blended strip": "The photo is not of a blended ink strip.",
  "wrong inks": "The inks named do not match the strip.",
  "spam or advertising": "It sells or promotes something.",
  "someone else's photo": "The photo belongs to someone else.",
  offensive: "It is hurtful or inappropriate.",
  other: "Something else: say what in the note.",
};

type Outcome = { tone: "success" | "info" | "warning"; title: string; body?: string };

/** "Report this strip" for members: a reason from our list and a note (needed for "other"). */
export function ReportStripButton({ stripId, onReported }: ReportStripButtonProps) {
  const id = useId();
  const [open, setOpen] = useState(false);
  const [outcome, setOutcome] = useState<Outcome | null>(null);
  const [failure, setFailure] = useState<{ message: string; details: string[] } | null>(null);
  const opener = useRef<HTMLButtonElement>(null);
  const report = useReportStrip(stripId);
  const {
    register,
    handleSubmit,
    setError,
    control,
    formState: { errors, isSubmitting },
  } = useForm<z.input<typeof reportInput>, unknown, z.output<typeof reportInput>>({ resolver: zodResolver(reportInput), defaultValues: { note: "" } });
  const reason = useWatch({ control, name: "reason" });

  const submit = handleSubmit(async (values) => {
    setFailure(null);
    try {
      const receipt = await report.mutateAsync(values);
      setOutcome({
        tone: "success",
        title: "Thank you — a moderator will look at it",
        body: receipt.held
          ? "Several members reported this strip, so it is out of view until a moderator decides."
          : "You will find a notice in your notices when it has been handled.",
      });
      setOpen(false);
      onReported?.(receipt);
    } catch (error) {
      if (isApiError(error) && error.code === "already_reported") {
        setOutcome({ tone: "info", title: "You already reported this strip", body: "A moderator will look at it. Each member can report a strip once." });
        setOpen(false);
        return;
      }
      if (isApiError(error) && error.code === "own_strip") {
        setOutcome({ tone: "warning", title: "This is your own strip", body: "You cannot report your own strip. You can edit or delete it instead." });
        setOpen(false);
        return;
      }
      setFailure({ message: errorMessage(error), details: applyApiFieldErrors(error, setError, ["reason", "note"]) });
    }
  });

  if (outcome) {
    return (
      <Notice tone={outcome.tone} title={outcome.title} live>
        {outcome.body && <p>{outcome.body}</p>}
      </Notice>
    );
  }

  return (
    <div className="flex flex-col gap-3">
      <div>
        <button
          ref={opener}
          type="button"
          aria-expanded={open}
          aria-controls={open ? `${id}-form` : undefined}
          onClick={() => setOpen((o) => !o)}
          className={buttonClasses("quiet", "-ml-2")}
        >
          <span aria-hidden="true">⚑</span> Report this strip
        </button>
      </div>
      {open && (
        <form
          id={`${id}-form`}
          noValidate
          onSubmit={submit}
          aria-labelledby={`${id}-title`}
          onKeyDown={(e) => {
            if (e.key === "Escape" && !isSubmitting) {
              setOpen(false);
              opener.current?.focus();
            }
          }}
          className="flex flex-col gap-3 rounded-lg border border-rule-strong bg-card p-4"
        >
          <h3 id={`${id}-title`} className="font-bold">
            What is wrong with this strip?
          </h3>
          <p className="text-sm text-ink-muted">A moderator reads every report. The author is not told who reported it.</p>
          <FormAlert message={failure?.message} details={failure?.details} />
          <fieldset className="flex flex-col gap-1" aria-describedby={errors.reason ? `${id}-reason-error` : undefined}>
            <legend className="mb-1 font-bold">Reason</legend>
            {reportReasons.map((r) => (
              <label key={r} className="flex min-h-11 cursor-pointer items-start gap-3 rounded-md px-1 py-1.5 hover:bg-paper-shade">
                <input type="radio" value={r} className="mt-1 h-5 w-5 shrink-0 accent-accent" aria-invalid={errors.reason ? true : undefined} {...register("reason")} />
                <span>
                  <span className="font-bold">{r.charAt(0).toUpperCase() + r.slice(1)}</span>
                  <span className="block text-sm text-ink-muted">{reasonHints[r]}</span>
                </span>
              </label>
            ))}
            {errors.reason && (
              <p id={`${id}-reason-error`} className="flex items-start gap-1.5 text-sm font-bold text-danger">
                <span aria-hidden="true">!</span>
                <span>Choose a reason from the list.</span>
              </p>
            )}
          </fieldset>
          <Field label="Note" optional={reason !== "other"} hint={reason === "other" ? "Say what is wrong." : undefined} error={errors.note?.message}>
            {(f) => <TextArea id={f.id} aria-describedby={f.describedBy} aria-invalid={f.invalid || undefined} rows={3} maxLength={1000} {...register("note")} />}
          </Field>
          <div className="flex flex-wrap gap-2">
            <Button type="submit" busy={isSubmitting} busyLabel="Sending…">
              Send report
            </Button>
            <Button
              variant="secondary"
              disabled={isSubmitting}
              onClick={() => {
                setOpen(false);
                opener.current?.focus();
              }}
            >
              Cancel
            </Button>
          </div>
        </form>
      )}
    </div>
  );
}
