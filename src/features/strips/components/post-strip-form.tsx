import { zodResolver } from "@hookform/resolvers/zod";
import { useState, type ReactNode } from "react";
import { useForm } from "react-hook-form";
import { Button } from "../../../components/ui/button";
import { FormAlert, Notice } from "../../../components/ui/notice";
import { errorMessage, isApiError } from "../../../lib/api-client";
import { applyApiFieldErrors } from "../../../lib/form-errors";
import { useCreateStrip, type CreatedStrip } from "../api/create-strip";
import { inkOrderProblemText, splitInkErrors } from "../form-errors";
import type { InkChoice, InkColourLookup, InkPickerSlot } from "../ink-choice";
import { notesForServer } from "../notes-text";
import { InkOrderEditor } from "./ink-order-editor";
import {
  StripDetailsFields,
  stripDetailFieldNames,
  stripDetailsSchema,
  type StripDetailsOutput,
  type StripDetailsValues,
} from "./strip-details-fields";

type PostStripFormProps = {
  uploadId: string;
  orientation: "horizontal" | "vertical";
  inks: InkChoice[];
  onInksChange: (inks: InkChoice[]) => void;
  inkColour: InkColourLookup;
  picker: InkPickerSlot;
  /** Why posting cannot happen right now (the photo is being analysed again…), or null. */
  blockedReason: string | null;
  /** Shown when the server says this photo is already a strip. */
  alreadyPostedHint?: ReactNode;
  onPosted: (result: CreatedStrip) => void;
};

const resolver = zodResolver(stripDetailsSchema);

/** The ink order and the details, sent together as POST /api/strips. */
export function PostStripForm({
  uploadId,
  orientation,
  inks,
  onInksChange,
  inkColour,
  picker,
  blockedReason,
  alreadyPostedHint,
  onPosted,
}: PostStripFormProps) {
  const createStrip = useCreateStrip();
  const [failure, setFailure] = useState<{ message: string; details: string[]; alreadyPosted: boolean } | null>(null);
  const [inkProblem, setInkProblem] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<StripDetailsValues, unknown, StripDetailsOutput>({
    resolver,
    defaultValues: { title: "", notes: "", paper: undefined, tools: [], videoUrl: "" },
  });

  function changeInks(next: InkChoice[]) {
    if (next.length > 0) setInkProblem(null);
    onInksChange(next);
  }

  const submit = handleSubmit(
    async (values) => {
      setFailure(null);
      if (inks.length === 0) {
        setInkProblem("Add at least one ink to the ink order.");
        return;
      }
      if (blockedReason) return;
      try {
        const created = await createStrip.mutateAsync({
          uploadId,
          title: values.title,
          notes: notesForServer(values.notes),
          paper: values.paper,
          tools: values.tools,
          videoUrl: values.videoUrl,
          inks: inks.map((i) => i.id),
        });
        onPosted(created);
      } catch (error) {
        const { inkProblem: inkText, rest } = splitInkErrors(error);
        if (inkText) setInkProblem(inkOrderProblemText(inkText));
        const details = applyApiFieldErrors(rest, setError, stripDetailFieldNames);
        setFailure({
          message: errorMessage(error),
          details,
          alreadyPosted: isApiError(error) && error.code === "already_posted",
        });
      }
    },
    () => {
      if (inks.length === 0) setInkProblem("Add at least one ink to the ink order.");
    },
  );

  return (
    <form noValidate onSubmit={submit} className="flex flex-col gap-10" aria-label="Post your strip">
      <InkOrderEditor
        inks={inks}
        onChange={changeInks}
        inkColour={inkColour}
        picker={picker}
        orientation={orientation}
        error={inkProblem ?? undefined}
      />

      <section aria-labelledby="post-details-title" className="flex flex-col gap-5">
        <div className="space-y-1">
          <h2 id="post-details-title" className="text-2xl font-bold">
            About your strip
          </h2>
          <p className="text-ink-soft">All fields are needed unless marked optional.</p>
        </div>
        <Notice tone="info" title="Post dried strips only">
          <p>
            Ink looks different wet and dry, so a strip photographed wet misleads everyone who compares with it. Let it
            dry fully first (heat-set pigment where needed).
          </p>
        </Notice>
        <StripDetailsFields register={register} errors={errors} />
        <p className="flex items-start gap-2 text-sm text-ink-soft">
          <span aria-hidden="true" className="mt-1.5 h-2 w-2 shrink-0 rounded-full bg-accent" />
          <span>
            Your privacy: location data (GPS) and every other hidden detail is removed from photos; only the picture is
            kept and shown.
          </span>
        </p>
      </section>

      <div className="flex flex-col gap-3 border-t border-rule pt-6">
        {failure && (
          <FormAlert message={failure.message} details={failure.details} />
        )}
        {failure?.alreadyPosted && alreadyPostedHint}
        {blockedReason && (
          <Notice tone="warning" live>
            <p>{blockedReason}</p>
          </Notice>
        )}
        <div>
          <Button type="submit" busy={isSubmitting} busyLabel="Posting…" disabled={blockedReason !== null} className="w-full sm:w-auto">
            Post strip
          </Button>
        </div>
      </div>
    </form>
  );
}
