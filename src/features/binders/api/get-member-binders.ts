import { queryOptions, useQuery } from "@tanstack/react-query";
import type { BinderSummary } from "../../../../shared/schemas/binders";
import { api } from "../../../lib/api-client";
import { binderKeys } from "./keys";

/** A member's public binders (all of them when the member is me). */
export async function getMemberBinders(memberId: string, signal?: AbortSignal): Promise<BinderSummary[]> {
  return (await api.get<{ items: BinderSummary[] }>(`/api/members/${encodeURIComponent(memberId)}/binders`, { signal })).items;
}

export const memberBindersQueryOptions = (memberId: string) =>
  queryOptions({
    queryKey: binderKeys.member(memberId),
    queryFn: ({ signal }) => getMemberBinders(memberId, signal),
  });

export function useMemberBinders(memberId: string) {
  return useQuery(memberBindersQueryOptions(memberId));
}
