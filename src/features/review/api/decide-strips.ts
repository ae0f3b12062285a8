import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { z } from "zod";
import type { bulkDecisionInput } from "../../../../shared/schemas/moderation";
import type { StripStatus } from "../../../../shared/schemas/strips";
import { api } from "../../../lib/api-client";
import { reviewKeys } from "./keys";

export type BulkDecision = z.output<typeof bulkDecisionInput>;
export type BulkResult = { id: number; ok: boolean; status?: StripStatus; error?: string };

/** POST /api/review-queue/decisions: each strip is decided on its own; one stale strip stops nothing. */
export function decideStrips(input: BulkDecision): Promise<{ results: BulkResult[] }> {
  return api.post<{ results: BulkResult[] }>("/api/review-queue/decisions", input);
}

export function useDecideStrips() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: decideStrips,
    meta: { errorsShownInline: true },
    onSettled: () => {
      void queryClient.invalidateQueries({ queryKey: reviewKeys.queue() });
      void queryClient.invalidateQueries({ queryKey: reviewKeys.logs() });
    },
  });
}
