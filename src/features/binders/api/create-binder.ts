import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { z } from "zod";
import type { Binder, binderInput } from "../../../../shared/schemas/binders";
import { api } from "../../../lib/api-client";
import { binderKeys } from "./keys";

export type NewBinder = z.output<typeof binderInput>;

export function createBinder(input: NewBinder): Promise<Binder> {
  return api.post<Binder>("/api/binders", input);
}

export function useCreateBinder() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createBinder,
    meta: { errorsShownInline: true },
    onSuccess: (binder) => {
      queryClient.setQueryData(binderKeys.detail(binder.id), binder);
      void queryClient.invalidateQueries({ queryKey: binderKeys.lists() });
    },
  });
}
