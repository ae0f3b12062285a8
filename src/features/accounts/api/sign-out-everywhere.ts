import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "../../../lib/api-client";
import { postAuthForm } from "./auth-form";
import { accountKeys } from "./keys";

/** POST /api/me/sign-out-everywhere ends every session on the server; then this browser forgets its cookie. */
export async function signOutEverywhere(): Promise<number> {
  const { ended } = await api.post<{ ended: number }>("/api/me/sign-out-everywhere");
  await postAuthForm("/auth/signout", {});
  return ended;
}

export function useSignOutEverywhere() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signOutEverywhere,
    meta: { errorsShownInline: true },
    onSuccess: () => {
      queryClient.clear();
      queryClient.setQueryData(accountKeys.me(), null);
    },
  });
}
