import { useMutation, useQueryClient } from "@tanstack/react-query";
import { accountKeys } from "./keys";
import { postAuthForm } from "./auth-form";

export type PasswordSignIn = { email: string; password: string; callbackUrl: string };

export async function signInWithPassword({ email, password, callbackUrl }: PasswordSignIn): Promise<void> {
  await postAuthForm("/auth/callback/credentials", { email, password, callbackUrl });
}

export function useSignInWithPassword() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signInWithPassword,
    meta: { errorsShownInline: true },
    // Wait for the fresh member so the next page does not see a stale "signed out".
    onSuccess: () => queryClient.invalidateQueries({ queryKey: accountKeys.me() }),
  });
}
