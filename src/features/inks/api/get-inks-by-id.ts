import { useQueries } from "@tanstack/react-query";
import type { Ink } from "../../../../shared/schemas/inks";
import { inkQueryOptions } from "./get-ink";

/**
 * Several inks by id (each cached as its own detail), for pages that know ink ids but not their
 * colours, such as an analysis's suggestions. Inks still loading or not found are missing.
 */
export function useInksById(ids: readonly number[]): Map<number, Ink> {
  const unique = [...new Set(ids)].sort((a, b) => a - b);
  return useQueries({
    queries: unique.map((id) => ({ ...inkQueryOptions(id), staleTime: 5 * 60_000, meta: { errorsShownInline: true } })),
    combine: (results) => {
      const map = new Map<number, Ink>();
      for (const r of results) if (r.data) map.set(r.data.id, r.data);
      return map;
    },
  });
}
