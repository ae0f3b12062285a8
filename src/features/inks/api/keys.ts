import type { InkFilters } from "../ink-filters";

export const inkKeys = {
  all: ["inks"] as const,
  lists: () => [...inkKeys.all, "list"] as const,
  list: (filters: InkFilters) => [...inkKeys.lists(), filters] as const,
  details: () => [...inkKeys.all, "detail"] as const,
  detail: (id: number) => [...inkKeys.details(), id] as const,
};

export const brandKeys = {
  all: ["brands"] as const,
  list: () => [...brandKeys.all, "list"] as const,
};
