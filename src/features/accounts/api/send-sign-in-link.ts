import { useMutation } from "@tanstack/react-query";
import { postAuthForm } from "./auth-form";

export type SignInLinkRequest = { email: string; callbackUrl: string };

/** Asks the server to e-mail a one-time sign-in link. */
export async function sendSignInLink({ email, callbackUrl }: SignInLinkRequest): Promise<void> {
  await postAuthForm("/auth/signin/nodemailer", { email, callbackUrl });
}

export function useSendSignInLink() {
  return useMutation({
    mutationFn: sendSignInLink,
    meta: { errorsShownInline: true },
  });
}
