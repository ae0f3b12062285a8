import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { z } from "zod";
import { passwordInput } from "../../../../shared/schemas/accounts";
import { Button } from "../../../components/ui/button";
import { TextField } from "../../../components/ui/field";
import { FormAlert } from "../../../components/ui/notice";
import { toast } from "../../../components/ui/toast";
import { errorMessage } from "../../../lib/api-client";
import { applyApiFieldErrors } from "../../../lib/form-errors";
import { useSetPassword } from "../api/set-password";

// The repeat box exists only here: the server gets passwordInput's shape.
const passwordFormSchema = passwordInput
  .extend({ repeatPassword: z.string() })
  .refine((v) => v.newPassword === v.repeatPassword, {
    message: "does not match the new password",
    path: ["repeatPassword"],
  });
type PasswordFormValues = z.input<typeof passwordFormSchema>;

export function PasswordForm({ email, hasPassword }: { email: string; hasPassword: boolean }) {
  const setPassword = useSetPassword();
  const [failure, setFailure] = useState<{ message: string; details: string[] } | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    reset,
    formState: { errors, isSubmitting },
  } = useForm<PasswordFormValues, unknown, z.output<typeof passwordFormSchema>>({
    resolver: zodResolver(passwordFormSchema),
    // Without a password there is no "current password" box, so it must not be sent.
    shouldUnregister: true,
  });

  const submit = handleSubmit(async ({ currentPassword, newPassword }) => {
    setFailure(null);
    try {
      await setPassword.mutateAsync(hasPassword ? { currentPassword, newPassword } : { newPassword });
      reset();
      toast.success(hasPassword ? "Your password is changed." : "Your password is set. You can now sign in with it.");
    } catch (error) {
      const details = applyApiFieldErrors(error, setError, ["currentPassword", "newPassword"]);
      setFailure({ message: errorMessage(error), details });
    }
  });

  return (
    <form noValidate onSubmit={submit} className="flex flex-col gap-5">
      {/* Lets password managers tie the new password to the account. */}
      <input type="email" name="username" autoComplete="username" hidden readOnly value={email} />
      <FormAlert message={failure?.message} details={failure?.details} />
      {hasPassword && (
        <TextField
          label="Current password"
          error={errors.currentPassword?.message}
          type="password"
          autoComplete="current-password"
          {...register("currentPassword")}
        />
      )}
      <TextField
        label="New password"
        hint="At least 10 characters. A few unrelated words work well."
        error={errors.newPassword?.message}
        type="password"
        autoComplete="new-password"
        {...register("newPassword")}
      />
      <TextField
        label="New password again"
        error={errors.repeatPassword?.message}
        type="password"
        autoComplete="new-password"
        {...register("repeatPassword")}
      />
      <div>
        <Button type="submit" busy={isSubmitting} busyLabel="Saving…">
          {hasPassword ? "Change password" : "Set password"}
        </Button>
      </div>
    </form>
  );
}
