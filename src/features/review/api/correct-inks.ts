import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { z } from "zod";
import type { inkCorrectionInput } from "../../../../shared/schemas/moderation";
import { api, isApiError } from "../../../lib/api-client";
import { reviewKeys } from "./keys";

export type InkCorrection = z.output<typeof inkCorrectionInput>;

/** PUT /api/strips/:id/inks: the new ink order; the bands are tagged again and the author told. */
export function correctInks(id: number, input: InkCorrection): Promise<{ id: number; version: number }> {
  return api.put<{ id: number; version: number }>(`/api/strips/${id}/inks`, input);
}

export function useCorrectInks() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, input }: { id: number; input: InkCorrection }) => correctInks(id, input),
    meta: { errorsShownInline: true },
    onSettled: (_data, error) => {
      if (!error || (isApiError(error) && error.status === 409)) void queryClient.invalidateQueries({ queryKey: reviewKeys.queue() });
      if (!error) void queryClient.invalidateQueries({ queryKey: reviewKeys.logs() });
    },
  });
}
