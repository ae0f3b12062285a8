import type { LogFilters } from "../log-filters";

export const reviewKeys = {
  all: ["review"] as const,
  queue: () => [...reviewKeys.all, "queue"] as const,
  /** Under queue(): whatever refreshes the queue refreshes the badge too. */
  queueCount: () => [...reviewKeys.queue(), "count"] as const,
  logs: () => [...reviewKeys.all, "log"] as const,
  /** The log page's infinite list ("load older"). */
  logPages: (filters: LogFilters) => [...reviewKeys.logs(), "pages", filters] as const,
  /** The latest few entries, e.g. on a member's moderation panel. */
  logLatest: (filters: LogFilters, limit: number) => [...reviewKeys.logs(), "latest", filters, limit] as const,
};
