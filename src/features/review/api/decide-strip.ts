import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { z } from "zod";
import type { decisionInput } from "../../../../shared/schemas/moderation";
import type { StripStatus } from "../../../../shared/schemas/strips";
import { api, isApiError } from "../../../lib/api-client";
import { reviewKeys } from "./keys";

export type Decision = z.output<typeof decisionInput>;
export type DecisionResult = { id: number; status: StripStatus; version: number };

/** POST /api/strips/:id/decisions. A stale `expectedVersion` is answered 409 "already_decided". */
export function decideStrip(id: number, decision: Decision): Promise<DecisionResult> {
  return api.post<DecisionResult>(`/api/strips/${id}/decisions`, decision);
}

/** True when another moderator (or the author) changed the strip first. */
export function isAlreadyDecided(error: unknown): boolean {
  return isApiError(error) && error.status === 409;
}

export function useDecideStrip() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, decision }: { id: number; decision: Decision }) => decideStrip(id, decision),
    meta: { errorsShownInline: true },
    onSettled: (_data, error) => {
      // After a success the strip leaves the queue; after a 409 the queue shows what changed.
      if (!error || isAlreadyDecided(error)) void queryClient.invalidateQueries({ queryKey: reviewKeys.queue() });
      if (!error) void queryClient.invalidateQueries({ queryKey: reviewKeys.logs() });
    },
  });
}
