import { keepPreviousData, queryOptions, useQuery } from "@tanstack/react-query";
import type { InkList } from "../../../../shared/schemas/inks";
import { api } from "../../../lib/api-client";
import { stashKeys } from "./keys";

export const CATALOGUE_RESULTS = 10;

/** The first catalogue inks whose name or brand matches what the member typed. */
export function searchCatalogue(q: string, signal?: AbortSignal): Promise<InkList> {
  return api.get<InkList>("/api/inks", { query: { q, pageSize: CATALOGUE_RESULTS }, signal });
}

export const catalogueSearchQueryOptions = (q: string) =>
  queryOptions({
    queryKey: stashKeys.catalogue(q),
    queryFn: ({ signal }) => searchCatalogue(q, signal),
    staleTime: 5 * 60_000,
    placeholderData: keepPreviousData,
  });

export function useCatalogueSearch(q: string) {
  return useQuery({ ...catalogueSearchQueryOptions(q), enabled: q.length > 0, meta: { errorsShownInline: true } });
}
