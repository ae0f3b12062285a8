import { queryOptions, useQuery } from "@tanstack/react-query";
import type { BesideList } from "../../../../shared/schemas/plan";
import { api } from "../../../lib/api-client";
import { planKeys } from "./keys";

export const besideQueryOptions = (inkId: number) =>
  queryOptions({
    queryKey: planKeys.beside(inkId),
    queryFn: ({ signal }) => api.get<BesideList>(`/api/inks/${inkId}/beside`, { signal }),
    staleTime: 60_000,
  });

export function useBeside(inkId: number) {
  return useQuery({ ...besideQueryOptions(inkId), meta: { errorsShownInline: true } });
}
