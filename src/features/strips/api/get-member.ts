import { queryOptions, useQuery } from "@tanstack/react-query";
import type { MemberProfile } from "../../../../shared/schemas/strips";
import { api } from "../../../lib/api-client";
import { memberKeys } from "./keys";

/** GET /api/members/:id: the profile and strips; the member (and moderators) also get unpublished ones. */
export function getMember(id: string, signal?: AbortSignal): Promise<MemberProfile> {
  return api.get<MemberProfile>(`/api/members/${id}`, { signal });
}

export const memberQueryOptions = (id: string) =>
  queryOptions({
    queryKey: memberKeys.detail(id),
    queryFn: ({ signal }) => getMember(id, signal),
  });

export function useMember(id: string) {
  return useQuery(memberQueryOptions(id));
}
