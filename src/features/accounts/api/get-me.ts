import { queryOptions, useQuery } from "@tanstack/react-query";
import type { Me } from "../../../../shared/schemas/accounts";
import { api, isApiError } from "../../../lib/api-client";
import { accountKeys } from "./keys";

/** The signed-in member, or null for a visitor (401 is an answer here, not an error). */
export async function getMe(signal?: AbortSignal): Promise<Me | null> {
  try {
    return await api.get<Me>("/api/me", { signal });
  } catch (error) {
    if (isApiError(error) && error.status === 401) return null;
    throw error;
  }
}

export const meQueryOptions = () =>
  queryOptions({
    queryKey: accountKeys.me(),
    queryFn: ({ signal }) => getMe(signal),
    staleTime: 60_000,
  });

export function useMe() {
  return useQuery(meQueryOptions());
}
