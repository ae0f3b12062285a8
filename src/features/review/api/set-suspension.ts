import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { z } from "zod";
import type { suspensionInput } from "../../../../shared/schemas/moderation";
import { api } from "../../../lib/api-client";
import { reviewKeys } from "./keys";

export type SuspensionChange = z.output<typeof suspensionInput>;

/** PUT /api/members/:id/suspension: `days` from now; 0 lifts a suspension. */
export function setSuspension(memberId: string, input: SuspensionChange): Promise<{ id: string; suspendedUntil: string | null }> {
  return api.put(`/api/members/${encodeURIComponent(memberId)}/suspension`, input);
}

export function useSetSuspension(memberId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: SuspensionChange) => setSuspension(memberId, input),
    meta: { errorsShownInline: true },
    onSuccess: () => queryClient.invalidateQueries({ queryKey: reviewKeys.logs() }),
  });
}
