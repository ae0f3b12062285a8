import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "../../../lib/api-client";
import { memberKeys, stripKeys } from "./keys";

export function deleteStrip(id: number): Promise<void> {
  return api.delete<void>(`/api/strips/${id}`);
}

export function useDeleteStrip(id: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => deleteStrip(id),
    onSuccess: () => {
      queryClient.removeQueries({ queryKey: stripKeys.detail(id) });
      void queryClient.invalidateQueries({ queryKey: stripKeys.lists() });
      void queryClient.invalidateQueries({ queryKey: memberKeys.all });
    },
  });
}
