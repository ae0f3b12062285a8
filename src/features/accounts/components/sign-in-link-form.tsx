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
import { useSendSignInLink } from "../api/send-sign-in-link";

const linkSchema = z.object({ email: emailSchema });

export function SignInLinkForm({ callbackUrl, onSent }: { callbackUrl: string; onSent: (email: string) => void }) {
  const id = useId();
  const sendLink = useSendSignInLink();
  const [failure, setFailure] = useState<{ message: string; details: string[] } | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<z.input<typeof linkSchema>, unknown, z.output<typeof linkSchema>>({ resolver: zodResolver(linkSchema) });

  const submit = handleSubmit(async ({ email }) => {
    setFailure(null);
    try {
      await sendLink.mutateAsync({ email, callbackUrl });
      onSent(email);
    } catch (error) {
      const details = applyApiFieldErrors(error, setError, ["email"]);
      setFailure({ message: errorMessage(error), details });
    }
  });

  return (
    <form noValidate onSubmit={submit} aria-labelledby={`${id}-title`} className="flex flex-col gap-4">
      <h2 id={`${id}-title`} className="text-xl font-bold">
        With a link by e-mail
      </h2>
      <p className="text-ink-soft">No password needed: the link signs you in.</p>
      <FormAlert message={failure?.message} details={failure?.details} />
      <TextField
        label="E-mail address"
        error={errors.email?.message}
        type="email"
        autoComplete="email"
        inputMode="email"
        spellCheck={false}
        {...register("email")}
      />
      <div>
        <Button type="submit" variant="secondary" busy={isSubmitting} busyLabel="Sending…">
          E-mail me a sign-in link
        </Button>
      </div>
    </form>
  );
}
