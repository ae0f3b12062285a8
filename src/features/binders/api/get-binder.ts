import { queryOptions, useQuery } from "@tanstack/react-query";
import type { Binder } from "../../../../shared/schemas/binders";
import { api } from "../../../lib/api-client";
import { binderKeys } from "./keys";

/** One binder with its items; a private binder of someone else is a 404, like a missing one. */
export function getBinder(id: number, signal?: AbortSignal): Promise<Binder> {
  return api.get<Binder>(`/api/binders/${id}`, { signal });
}

export const binderQueryOptions = (id: number) =>
  queryOptions({
    queryKey: binderKeys.detail(id),
    queryFn: ({ signal }) => getBinder(id, signal),
  });

export function useBinder(id: number) {
  return useQuery(binderQueryOptions(id));
}
