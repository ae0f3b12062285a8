import { queryOptions, useQuery } from "@tanstack/react-query";
import type { Strip } from "../../../../shared/schemas/strips";
import { api } from "../../../lib/api-client";
import { stripKeys } from "./keys";

export function getRelatedStrips(id: number, signal?: AbortSignal): Promise<{ items: Strip[] }> {
  return api.get<{ items: Strip[] }>(`/api/strips/${id}/related`, { signal });
}

export const relatedStripsQueryOptions = (id: number) =>
  queryOptions({
    queryKey: stripKeys.related(id),
    queryFn: ({ signal }) => getRelatedStrips(id, signal),
    select: (data) => data.items,
  });

export function useRelatedStrips(id: number) {
  return useQuery(relatedStripsQueryOptions(id));
}
