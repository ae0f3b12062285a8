import type { InkFilters } from "../ink-filters";

export const inkKeys = {
  all: ["inks"] as const,
  lists: () => [...inkKeys.all, "list"] as const,
  list: (filters: InkFilters) => [...inkKeys.lists(), filters] as const,
  // Look-alikes sit under lists(): creating or editing any ink (which already invalidates
  // lists()) can change every ink's look-alikes.
  lookAlikeLists: () => [...inkKeys.lists(), "look-alikes"] as const,
  /** The answer marks the viewer's own inks, so who is asking is part of the key (null: a visitor). */
  lookAlikes: (id: number, viewerId: string | null) => [...inkKeys.lookAlikeLists(), id, viewerId] as const,
  details: () => [...inkKeys.all, "detail"] as const,
  detail: (id: number) => [...inkKeys.details(), id] as const,
};

export const brandKeys = {
  all: ["brands"] as const,
  list: () => [...brandKeys.all, "list"] as const,
};
