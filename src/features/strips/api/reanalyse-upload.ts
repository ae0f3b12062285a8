import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { z } from "zod";
import type { reanalyseInput, Upload } from "../../../../shared/schemas/uploads";
import { api } from "../../../lib/api-client";
import { uploadKeys } from "./keys";

export type ReanalyseInput = z.input<typeof reanalyseInput>;

/** POST /api/uploads/:id/analysis: run the analysis again, with a tapped paper-white point or without. */
export function reanalyseUpload(id: string, input: ReanalyseInput): Promise<{ id: string; status: "processing" }> {
  return api.post(`/api/uploads/${id}/analysis`, input);
}

export function useReanalyseUpload(id: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: ReanalyseInput) => reanalyseUpload(id, input),
    onSuccess: () => {
      // "processing" restarts the polling at once.
      queryClient.setQueryData<Upload>(uploadKeys.detail(id), (old) =>
        old ? { id: old.id, createdAt: old.createdAt, status: "processing" } : old,
      );
      void queryClient.invalidateQueries({ queryKey: uploadKeys.detail(id) });
    },
  });
}
