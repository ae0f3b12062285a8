import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { z } from "zod";
import type { Ink, inkInput } from "../../../../shared/schemas/inks";
import { api } from "../../../lib/api-client";
import { brandKeys, inkKeys } from "./keys";

export type NewInk = z.output<typeof inkInput>;

export function createInk(input: NewInk): Promise<Ink> {
  return api.post<Ink>("/api/inks", input);
}

export function useCreateInk() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createInk,
    meta: { errorsShownInline: true },
    onSuccess: (ink) => {
      queryClient.setQueryData(inkKeys.detail(ink.id), ink);
      void queryClient.invalidateQueries({ queryKey: inkKeys.lists() });
      // A brand's ink count changed.
      void queryClient.invalidateQueries({ queryKey: brandKeys.list() });
    },
  });
}
