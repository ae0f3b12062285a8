import { SegmentedChoice } from "../../../components/ui/segmented-choice";

type Placement = "anywhere" | "adjacent";

const options = [
  { value: "anywhere", label: "Anywhere" },
  { value: "adjacent", label: "Next to each other" },
] as const;

/** With two inks: anywhere in the strip, or directly beside each other in the ink order. */
export function InkPlacementChoice({ adjacent, onChange }: { adjacent: boolean; onChange: (adjacent: boolean) => void }) {
  return (
    <div className="flex flex-col gap-1">
      <SegmentedChoice<Placement>
        legend="Where the two inks sit in the strip"
        caption="The two inks:"
        options={options}
        value={adjacent ? "adjacent" : "anywhere"}
        onChange={(v) => onChange(v === "adjacent")}
      />
      <p className="text-sm text-ink-muted">Next to each other: blended straight into one another, either way round.</p>
    </div>
  );
}
