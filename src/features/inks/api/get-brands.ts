import { queryOptions, useQuery } from "@tanstack/react-query";
import type { Brand } from "../../../../shared/schemas/inks";
import { api } from "../../../lib/api-client";
import { brandKeys } from "./keys";

export function getBrands(signal?: AbortSignal): Promise<Brand[]> {
  return api.get<Brand[]>("/api/brands", { signal });
}

export const brandsQueryOptions = () =>
  queryOptions({
    queryKey: brandKeys.list(),
    queryFn: ({ signal }) => getBrands(signal),
    staleTime: 5 * 60_000,
    select: (brands) => [...brands].sort((a, b) => a.name.localeCompare(b.name)),
  });

export function useBrands() {
  return useQuery(brandsQueryOptions());
}
