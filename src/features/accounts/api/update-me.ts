import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { z } from "zod";
import type { Me, profilePatch } from "../../../../shared/schemas/accounts";
import { api } from "../../../lib/api-client";
import { accountKeys } from "./keys";

export type ProfilePatch = z.output<typeof profilePatch>;

export function updateMe(patch: ProfilePatch): Promise<Me> {
  return api.patch<Me>("/api/me", patch);
}

export function useUpdateMe() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateMe,
    meta: { errorsShownInline: true },
    onSuccess: (me) => {
      queryClient.setQueryData(accountKeys.me(), me);
    },
  });
}
