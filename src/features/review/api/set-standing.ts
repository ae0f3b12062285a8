import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { z } from "zod";
import type { standingInput } from "../../../../shared/schemas/moderation";
import { api } from "../../../lib/api-client";
import { reviewKeys } from "./keys";

export type StandingChange = z.output<typeof standingInput>;

/** PUT /api/members/:id/standing: trusted members' strips skip the review queue. */
export function setStanding(memberId: string, input: StandingChange): Promise<{ id: string; standing: StandingChange["standing"] }> {
  return api.put(`/api/members/${encodeURIComponent(memberId)}/standing`, input);
}

export function useSetStanding(memberId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: StandingChange) => setStanding(memberId, input),
    meta: { errorsShownInline: true },
    onSuccess: () => queryClient.invalidateQueries({ queryKey: reviewKeys.all }),
  });
}
