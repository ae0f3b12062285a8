import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { useForm } from "react-hook-form";
import type { Strip, StripPatch } from "../../../../shared/schemas/strips";
import { Button } from "../../../components/ui/button";
import { FormAlert, Notice } from "../../../components/ui/notice";
import { toast } from "../../../components/ui/toast";
import { errorMessage, isApiError } from "../../../lib/api-client";
import { applyApiFieldErrors } from "../../../lib/form-errors";
import { useUpdateStrip } from "../api/update-strip";
import { inkOrderProblemText, splitInkErrors } from "../form-errors";
import type { InkChoice, InkPickerSlot } from "../ink-choice";
import { notesForServer, notesToText } from "../notes-text";
import { InkOrderEditor } from "./ink-order-editor";
import {
  StripDetailsFields,
  stripDetailFieldNames,
  stripDetailsSchema,
  type StripDetailsOutput,
  type StripDetailsValues,
} from "./strip-details-fields";

const resolver = zodResolver(stripDetailsSchema);

type EditStripFormProps = {
  strip: Strip;
  /** The author's standing: a new member's edit of a published strip goes back to review. */
  standing: "new" | "trusted";
  picker: InkPickerSlot;
  onDone: () => void;
  /** Load the strip afresh (after someone else's change made this copy stale). */
  onReload: () => void;
};

const sameIds = (a: number[], b: number[]) => a.length === b.length && a.every((id, i) => id === b[i]);

/** PATCH /api/strips/:id with the changed fields and the version the editor started from. */
export function EditStripForm({ strip, standing, picker, onDone, onReload }: EditStripFormProps) {
  const updateStrip = useUpdateStrip(strip.id);
  const [inks, setInks] = useState<InkChoice[]>(() =>
    strip.inks.map((i) => ({ id: i.id, name: i.name, brand: i.brand, hex: i.hex, lab: i.lab })),
  );
  const [inkProblem, setInkProblem] = useState<string | null>(null);
  const [failure, setFailure] = useState<{ message: string; details: string[]; stale: boolean } | null>(null);
  const [note, setNote] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting, dirtyFields },
  } = useForm<StripDetailsValues, unknown, StripDetailsOutput>({
    resolver,
    defaultValues: {
      title: strip.title,
      notes: notesToText(strip.notes),
      paper: strip.paper,
      tools: strip.tools,
      videoUrl: strip.videoUrl ?? "",
    },
  });

  const goesToReview = standing !== "trusted" && strip.status === "published";

  const submit = handleSubmit(async (values) => {
    setFailure(null);
    setNote(null);
    if (inks.length === 0) {
      setInkProblem("Add at least one ink to the ink order.");
      return;
    }
    const patch: StripPatch = {};
    if (dirtyFields.title) patch.title = values.title;
    if (dirtyFields.notes) patch.notes = notesForServer(values.notes);
    if (dirtyFields.paper) patch.paper = values.paper;
    if (dirtyFields.tools) patch.tools = values.tools;
    // An emptied box clears the link ("" on the wire; the schema's output turns it into undefined).
    if (dirtyFields.videoUrl) patch.videoUrl = values.videoUrl ?? "";
    const ids = inks.map((i) => i.id);
    if (!sameIds(ids, strip.inks.map((i) => i.id))) patch.inks = ids;
    if (Object.keys(patch).length === 0) {
      setNote("Nothing has changed yet.");
      return;
    }
    try {
      const saved = await updateStrip.mutateAsync({ ...patch, expectedVersion: strip.version });
      if (saved.status === "pending" && strip.status !== "pending") {
        toast.info("Your changes are saved. The strip is waiting for review by a moderator again.");
      } else {
        toast.success("Your changes are saved.");
      }
      onDone();
    } catch (error) {
      const { inkProblem: inkText, rest } = splitInkErrors(error);
      if (inkText) setInkProblem(inkOrderProblemText(inkText));
      const details = applyApiFieldErrors(rest, setError, stripDetailFieldNames);
      setFailure({ message: errorMessage(error), details, stale: isApiError(error) && error.code === "stale_version" });
    }
  });

  return (
    <form noValidate onSubmit={submit} className="flex flex-col gap-8" aria-label="Edit your strip">
      {goesToReview ? (
        <Notice tone="warning" title="Your edit goes back to review">
          <p>
            While you are a new member, an edited strip waits in the review queue again until a moderator approves it.
            Until then only you and the moderators can see it.
          </p>
        </Notice>
      ) : strip.status === "returned" ? (
        <Notice tone="info" title="Saving sends it back to review">
          <p>Saving your changes puts the strip in the review queue again.</p>
        </Notice>
      ) : null}
      <FormAlert message={failure?.message} details={failure?.details} />
      {failure?.stale && (
        <Button variant="secondary" className="self-start" onClick={onReload}>
          Load the latest version
        </Button>
      )}
      {note && (
        <Notice tone="info" live>
          {note}
        </Notice>
      )}
      <InkOrderEditor
        inks={inks}
        onChange={(next) => {
          if (next.length) setInkProblem(null);
          setInks(next);
        }}
        inkColour={() => undefined}
        picker={picker}
        orientation={strip.orientation}
        error={inkProblem ?? undefined}
        intro="Move, remove or add inks; the bands are matched to the new ink order when you save."
      />
      <StripDetailsFields register={register} errors={errors} />
      <div className="flex flex-wrap gap-3 border-t border-rule pt-5">
        <Button type="submit" busy={isSubmitting} busyLabel="Saving…">
          Save changes
        </Button>
        <Button variant="secondary" onClick={onDone}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
