import { stripSorts } from "../../../shared/schemas/strips";

export type StripSort = (typeof stripSorts)[number];

export const sortLabels: Record<StripSort, string> = {
  newest: "Newest",
  saves: "Most saved",
};

/** ?sort= from the address; anything unknown is the default. */
export function sortFromSearchParams(params: URLSearchParams): StripSort {
  const raw = params.get("sort");
  return (stripSorts as readonly string[]).includes(raw ?? "") ? (raw as StripSort) : "newest";
}

export const GALLERY_PAGE_SIZE = 12;
