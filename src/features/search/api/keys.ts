import type { searchApiQuery } from "../search-state";

/**
 * Search results live under the strips' root key ("strips"), so whatever invalidates strips
 * (a save, an edit, a moderation decision) refreshes open searches too.
 */
export const searchKeys = {
  all: ["strips", "search"] as const,
  results: (query: ReturnType<typeof searchApiQuery>, viewer: string | null) => [...searchKeys.all, viewer, query] as const,
};
