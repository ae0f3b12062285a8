import type { BridgeInkChoice } from "../../../../shared/schemas/plan";

/** What the bridge finder asks for (the page's own form of GET /api/bridges' query). */
export type BridgeRequest = { from: number; to: number; inks: BridgeInkChoice; sameBrand: boolean; limit: number };

export const planKeys = {
  all: ["plan"] as const,
  bridges: () => [...planKeys.all, "bridges"] as const,
  bridgeList: (q: BridgeRequest, viewerId: string | null) => [...planKeys.bridges(), q, viewerId] as const,
  beside: (inkId: number) => [...planKeys.all, "beside", inkId] as const,
  binderPlans: (binderId: number) => [...planKeys.all, "binder-plans", binderId] as const,
};
