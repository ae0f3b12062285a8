import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { z } from "zod";
import type { passwordInput } from "../../../../shared/schemas/accounts";
import { api } from "../../../lib/api-client";
import { accountKeys } from "./keys";

export type PasswordInput = z.output<typeof passwordInput>;

export function setPassword(input: PasswordInput): Promise<void> {
  return api.put<void>("/api/me/password", input);
}

export function useSetPassword() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: setPassword,
    meta: { errorsShownInline: true },
    // `hasPassword` may have changed.
    onSuccess: () => queryClient.invalidateQueries({ queryKey: accountKeys.me() }),
  });
}
