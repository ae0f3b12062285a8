import { stripSorts } from "../../../../shared/schemas/strips";
import { SegmentedChoice } from "../../../components/ui/segmented-choice";
import { sortLabels, type StripSort } from "../strip-filters";

const options = stripSorts.map((sort) => ({ value: sort, label: sortLabels[sort] }));

/** Newest / most saved, as a pair of radio buttons styled as one switch. */
export function SortSwitch({ value, onChange }: { value: StripSort; onChange: (sort: StripSort) => void }) {
  return <SegmentedChoice legend="Sort strips" caption="Sort:" options={options} value={value} onChange={onChange} />;
}
