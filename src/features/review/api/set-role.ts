import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { z } from "zod";
import type { roleInput } from "../../../../shared/schemas/moderation";
import { api } from "../../../lib/api-client";
import { reviewKeys } from "./keys";

export type RoleChange = z.output<typeof roleInput>;

/** PUT /api/members/:id/role (admins only). */
export function setRole(memberId: string, input: RoleChange): Promise<{ id: string; role: RoleChange["role"] }> {
  return api.put(`/api/members/${encodeURIComponent(memberId)}/role`, input);
}

export function useSetRole(memberId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: RoleChange) => setRole(memberId, input),
    meta: { errorsShownInline: true },
    onSuccess: () => queryClient.invalidateQueries({ queryKey: reviewKeys.logs() }),
  });
}
