import type { StripSort } from "../strip-filters";

/** A gallery list's filters; the cursor is the infinite query's page parameter, not part of the key. */
export type StripListFilters = {
  sort: StripSort;
  ink?: number;
  author?: string;
  limit: number;
};

export const stripKeys = {
  all: ["strips"] as const,
  lists: () => [...stripKeys.all, "list"] as const,
  list: (filters: StripListFilters) => [...stripKeys.lists(), filters] as const,
  details: () => [...stripKeys.all, "detail"] as const,
  detail: (id: number) => [...stripKeys.details(), id] as const,
  related: (id: number) => [...stripKeys.detail(id), "related"] as const,
};

export const uploadKeys = {
  all: ["uploads"] as const,
  detail: (id: string) => [...uploadKeys.all, id] as const,
};

export const memberKeys = {
  all: ["members"] as const,
  detail: (id: string) => [...memberKeys.all, id] as const,
};
