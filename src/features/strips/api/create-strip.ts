import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { z } from "zod";
import type { StripStatus, stripInput } from "../../../../shared/schemas/strips";
import { api } from "../../../lib/api-client";
import { memberKeys, stripKeys } from "./keys";

export type NewStrip = z.input<typeof stripInput>;
export type CreatedStrip = { id: number; status: Extract<StripStatus, "published" | "pending"> };

export function createStrip(input: NewStrip): Promise<CreatedStrip> {
  return api.post<CreatedStrip>("/api/strips", input);
}

export function useCreateStrip() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createStrip,
    meta: { errorsShownInline: true },
    onSuccess: () => {
      void queryClient.invalidateQueries({ queryKey: stripKeys.lists() });
      void queryClient.invalidateQueries({ queryKey: memberKeys.all });
    },
  });
}
