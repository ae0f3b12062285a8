import { inkTypes, type InkType } from "../../../shared/schemas/inks";

export const discontinuedChoices = ["include", "exclude", "only"] as const;
export type DiscontinuedChoice = (typeof discontinuedChoices)[number];

/** The ink list's filters as they live in the URL, so a search can be shared as a link. */
export type InkFilters = {
  q?: string;
  brand?: string;
  type?: InkType;
  discontinued: DiscontinuedChoice;
  page: number;
  pageSize: number;
};

export const INK_PAGE_SIZE = 48;

function oneOf<T extends string>(value: string | null, allowed: readonly T[]): T | undefined {
  return value !== null && (allowed as readonly string[]).includes(value) ? (value as T) : undefined;
}

/** Reads filters from search params, dropping anything the server would refuse. */
export function filtersFromSearchParams(params: URLSearchParams): InkFilters {
  const q = params.get("q")?.trim().slice(0, 100) || undefined;
  const brandRaw = params.get("brand")?.trim();
  const brand = brandRaw && /^[a-z0-9-]{1,60}$/.test(brandRaw) ? brandRaw : undefined;
  const pageRaw = Number(params.get("page"));
  const page = Number.isInteger(pageRaw) && pageRaw >= 1 && pageRaw <= 10_000 ? pageRaw : 1;
  return {
    q,
    brand,
    type: oneOf(params.get("type"), inkTypes),
    discontinued: oneOf(params.get("discontinued"), discontinuedChoices) ?? "include",
    page,
    pageSize: INK_PAGE_SIZE,
  };
}

/** The shortest search string for these filters: defaults are left out. */
export function filtersToSearchParams(filters: Partial<InkFilters>): URLSearchParams {
  const params = new URLSearchParams();
  if (filters.q) params.set("q", filters.q);
  if (filters.brand) params.set("brand", filters.brand);
  if (filters.type) params.set("type", filters.type);
  if (filters.discontinued && filters.discontinued !== "include") params.set("discontinued", filters.discontinued);
  if (filters.page && filters.page > 1) params.set("page", String(filters.page));
  return params;
}

export function hasActiveFilters(filters: InkFilters): boolean {
  return Boolean(filters.q || filters.brand || filters.type || filters.discontinued !== "include");
}
