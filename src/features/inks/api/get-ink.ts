import { queryOptions, useQuery } from "@tanstack/react-query";
import type { Ink } from "../../../../shared/schemas/inks";
import { api } from "../../../lib/api-client";
import { inkKeys } from "./keys";

export function getInk(id: number, signal?: AbortSignal): Promise<Ink> {
  return api.get<Ink>(`/api/inks/${id}`, { signal });
}

export const inkQueryOptions = (id: number) =>
  queryOptions({
    queryKey: inkKeys.detail(id),
    queryFn: ({ signal }) => getInk(id, signal),
  });

export function useInk(id: number) {
  return useQuery(inkQueryOptions(id));
}
