import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { BinderSummary } from "../../../../shared/schemas/binders";
import { api } from "../../../lib/api-client";
import { binderKeys } from "./keys";

export function deleteBinder(id: number): Promise<void> {
  return api.delete<void>(`/api/binders/${id}`);
}

export function useDeleteBinder() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteBinder,
    onSuccess: (_data, id) => {
      queryClient.removeQueries({ queryKey: binderKeys.detail(id) });
      queryClient.setQueryData<BinderSummary[] | null>(binderKeys.mine(), (old) => old?.filter((b) => b.id !== id) ?? old);
      void queryClient.invalidateQueries({ queryKey: binderKeys.lists() });
      // The strips it held are no longer saved in it.
      void queryClient.invalidateQueries({ queryKey: [...binderKeys.all, "saved-in"] });
    },
  });
}
