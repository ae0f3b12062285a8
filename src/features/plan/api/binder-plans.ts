import { queryOptions, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type { BinderPlan, BinderPlanList } from "../../../../shared/schemas/plan";
import { api } from "../../../lib/api-client";
import { planKeys } from "./keys";

export const binderPlansQueryOptions = (binderId: number) =>
  queryOptions({
    queryKey: planKeys.binderPlans(binderId),
    queryFn: ({ signal }) => api.get<BinderPlanList>(`/api/binders/${binderId}/plans`, { signal }),
  });

export function useBinderPlans(binderId: number) {
  return useQuery({ ...binderPlansQueryOptions(binderId), meta: { errorsShownInline: true } });
}

/** Saves a plan (inks in order) to one of my binders as a planned strip. */
export function useSavePlan() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ binderId, inks }: { binderId: number; inks: number[] }) => api.post<BinderPlan>(`/api/binders/${binderId}/plans`, { inks }),
    meta: { errorsShownInline: true },
    onSuccess: (_plan, { binderId }) => void queryClient.invalidateQueries({ queryKey: planKeys.binderPlans(binderId) }),
  });
}

export function useRemovePlan(binderId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (planId: number) => api.delete<void>(`/api/binders/${binderId}/plans/${planId}`),
    meta: { errorsShownInline: true },
    onSettled: () => void queryClient.invalidateQueries({ queryKey: planKeys.binderPlans(binderId) }),
  });
}
