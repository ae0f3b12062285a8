import { queryOptions, useQuery } from "@tanstack/react-query";
import type { CapturedMail } from "../../../../shared/schemas/accounts";
import { api, isApiError } from "../../../lib/api-client";
import { devMailKeys } from "./keys";

/**
 * Captured outgoing mail, newest first; null when the viewer is switched off (404), "admins-only"
 * when the visitor is not signed in as an admin (the mail holds sign-in links).
 */
export async function getDevMail(signal?: AbortSignal): Promise<CapturedMail[] | null | "admins-only"> {
  try {
    const { messages } = await api.get<{ messages: CapturedMail[] }>("/api/dev/mail", { signal });
    return [...messages].sort((x, y) => Date.parse(y.date) - Date.parse(x.date));
  } catch (error) {
    if (isApiError(error) && error.status === 404) return null;
    if (isApiError(error) && (error.status === 401 || error.status === 403)) return "admins-only";
    throw error;
  }
}

export const devMailQueryOptions = () =>
  queryOptions({
    queryKey: devMailKeys.list(),
    queryFn: ({ signal }) => getDevMail(signal),
    staleTime: 0,
    meta: { errorsShownInline: true },
  });

export function useDevMail() {
  return useQuery(devMailQueryOptions());
}
