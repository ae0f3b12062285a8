import { queryOptions, useQuery } from "@tanstack/react-query";
import type { Strip } from "../../../../shared/schemas/strips";
import { api } from "../../../lib/api-client";
import { stripKeys } from "./keys";

export function getStrip(id: number, signal?: AbortSignal): Promise<Strip> {
  return api.get<Strip>(`/api/strips/${id}`, { signal });
}

export const stripQueryOptions = (id: number) =>
  queryOptions({
    queryKey: stripKeys.detail(id),
    queryFn: ({ signal }) => getStrip(id, signal),
  });

export function useStrip(id: number) {
  return useQuery(stripQueryOptions(id));
}
