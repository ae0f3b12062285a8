import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { Binder } from "../../../../shared/schemas/binders";
import { api } from "../../../lib/api-client";
import { binderKeys } from "./keys";

export type BinderItemNote = { binderId: number; stripId: number; note: string };

export function updateBinderItemNote({ binderId, stripId, note }: BinderItemNote): Promise<void> {
  return api.patch<void>(`/api/binders/${binderId}/items/${stripId}`, { note });
}

export function useUpdateBinderItemNote() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateBinderItemNote,
    meta: { errorsShownInline: true },
    onSuccess: (_data, { binderId, stripId, note }) => {
      queryClient.setQueryData<Binder>(binderKeys.detail(binderId), (old) =>
        old ? { ...old, items: old.items.map((i) => (i.stripId === stripId ? { ...i, note: note.trim() } : i)) } : old,
      );
    },
  });
}
