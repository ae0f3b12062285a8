import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { useForm, useWatch } from "react-hook-form";
import type { z } from "zod";
import { profilePatch, type Me } from "../../../../shared/schemas/accounts";
import { Button } from "../../../components/ui/button";
import { Field, TextArea, TextField } from "../../../components/ui/field";
import { FormAlert } from "../../../components/ui/notice";
import { toast } from "../../../components/ui/toast";
import { errorMessage } from "../../../lib/api-client";
import { applyApiFieldErrors } from "../../../lib/form-errors";
import { useUpdateMe } from "../api/update-me";

type ProfileValues = z.input<typeof profilePatch>;

export function ProfileForm({ me }: { me: Me }) {
  const updateMe = useUpdateMe();
  const [failure, setFailure] = useState<{ message: string; details: string[] } | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    reset,
    control,
    formState: { errors, isSubmitting, isDirty },
  } = useForm<ProfileValues, unknown, z.output<typeof profilePatch>>({
    resolver: zodResolver(profilePatch),
    defaultValues: { name: me.name, bio: me.bio },
  });
  const bioLength = (useWatch({ control, name: "bio" }) ?? "").length;

  const submit = handleSubmit(async (values) => {
    setFailure(null);
    try {
      const updated = await updateMe.mutateAsync(values);
      reset({ name: updated.name, bio: updated.bio });
      toast.success("Your profile is saved.");
    } catch (error) {
      const details = applyApiFieldErrors(error, setError, ["name", "bio"]);
      setFailure({ message: errorMessage(error), details });
    }
  });

  return (
    <form noValidate onSubmit={submit} className="flex flex-col gap-5">
      <FormAlert message={failure?.message} details={failure?.details} />
      <TextField
        label="Name"
        hint="Shown beside your strips. 2 to 60 characters."
        error={errors.name?.message}
        autoComplete="nickname"
        maxLength={60}
        {...register("name")}
      />
      <Field
        label="About you"
        optional
        hint={`What you make, the papers and tools you like. ${bioLength} of 500 characters.`}
        error={errors.bio?.message}
      >
        {(f) => (
          <TextArea
            id={f.id}
            aria-describedby={f.describedBy}
            aria-invalid={f.invalid || undefined}
            maxLength={500}
            rows={4}
            {...register("bio")}
          />
        )}
      </Field>
      <div>
        <Button type="submit" busy={isSubmitting} busyLabel="Saving…" disabled={!isDirty}>
          Save profile
        </Button>
      </div>
    </form>
  );
}
