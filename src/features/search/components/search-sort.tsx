import type { SearchSort } from "../../../../shared/schemas/search";
import { SegmentedChoice } from "../../../components/ui/segmented-choice";

const labels: Record<SearchSort, string> = { closest: "Closest colour", newest: "Newest", saves: "Most saved" };
const withColour = (["closest", "newest", "saves"] as const).map((value) => ({ value, label: labels[value] }));
const withoutColour = withColour.slice(1);

/** The result order; "closest colour" is offered only when the search has a colour. */
export function SearchSortSwitch({ value, hasColour, onChange }: { value: SearchSort; hasColour: boolean; onChange: (sort: SearchSort) => void }) {
  return <SegmentedChoice legend="Order of the results" caption="Order:" options={hasColour ? withColour : withoutColour} value={value} onChange={onChange} />;
}
