import { keepPreviousData, queryOptions, useQuery } from "@tanstack/react-query";
import type { InkList } from "../../../../shared/schemas/inks";
import { api } from "../../../lib/api-client";
import type { InkFilters } from "../ink-filters";
import { inkKeys } from "./keys";

export function getInks(filters: InkFilters, signal?: AbortSignal): Promise<InkList> {
  return api.get<InkList>("/api/inks", { query: filters, signal });
}

export const inksQueryOptions = (filters: InkFilters) =>
  queryOptions({
    queryKey: inkKeys.list(filters),
    queryFn: ({ signal }) => getInks(filters, signal),
    // Keep the last page on screen while the next one loads, so the list does not jump.
    placeholderData: keepPreviousData,
  });

export function useInks(filters: InkFilters) {
  return useQuery(inksQueryOptions(filters));
}
