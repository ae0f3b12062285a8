import { zodResolver } from "@hookform/resolvers/zod";
import { useId, useState } from "react";
import { useForm } from "react-hook-form";
import { z } from "zod";
import { emailSchema } from "../../../../shared/schemas/accounts";
import { Button } from "../../../components/ui/button";
import { TextField } from "../../../components/ui/field";
import { FormAlert } from "../../../components/ui/notice";
import { errorMessage } from "../../../lib/api-client";
import { applyApiFieldErrors } from "../../../lib/form-errors";
import { useSignInWithPassword } from "../api/sign-in-with-password";

const passwordSignInSchema = z.object({
  email: emailSchema,
  password: z.string().min(1, "is required").max(200, "must be at most 200 characters"),
});
type PasswordSignInValues = z.input<typeof passwordSignInSchema>;

export function PasswordSignInForm({ callbackUrl, onSignedIn }: { callbackUrl: string; onSignedIn: () => void }) {
  const id = useId();
  const signIn = useSignInWithPassword();
  const [failure, setFailure] = useState<{ message: string; details: string[] } | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<PasswordSignInValues, unknown, z.output<typeof passwordSignInSchema>>({
    resolver: zodResolver(passwordSignInSchema),
  });

  const submit = handleSubmit(async (values) => {
    setFailure(null);
    try {
      await signIn.mutateAsync({ ...values, callbackUrl });
      onSignedIn();
    } catch (error) {
      const details = applyApiFieldErrors(error, setError, ["email", "password"]);
      setFailure({ message: errorMessage(error), details });
    }
  });

  return (
    <form noValidate onSubmit={submit} aria-labelledby={`${id}-title`} className="flex flex-col gap-4">
      <h2 id={`${id}-title`} className="text-xl font-bold">
        With your password
      </h2>
      <FormAlert message={failure?.message} details={failure?.details} />
      <TextField
        label="E-mail address"
        error={errors.email?.message}
        type="email"
        autoComplete="username"
        inputMode="email"
        spellCheck={false}
        {...register("email")}
      />
      <TextField
        label="Password"
        error={errors.password?.message}
        type="password"
        autoComplete="current-password"
        {...register("password")}
      />
      <div>
        <Button type="submit" busy={isSubmitting} busyLabel="Signing in…">
          Sign in
        </Button>
      </div>
    </form>
  );
}
