import { useMutation, useQueryClient } from "@tanstack/react-query";
import { postAuthForm } from "./auth-form";
import { accountKeys } from "./keys";

export async function signOut(): Promise<void> {
  await postAuthForm("/auth/signout", {});
}

export function useSignOut() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signOut,
    onSuccess: () => {
      // Nothing a member saw may linger for the next person at this screen.
      queryClient.clear();
      queryClient.setQueryData(accountKeys.me(), null);
    },
  });
}
