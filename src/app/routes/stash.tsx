import { PageHeader } from "../../components/ui/page-header";
import { RequireRole } from "../../features/accounts/components/require-role";
import { InkPicker } from "../../features/inks/components/ink-picker";
import { PrintLinks } from "../../features/plan/components/print-links";
import { MyStash, type StashInkPickerSlot } from "../../features/stash/components/my-stash";

const stashPicker: StashInkPickerSlot = ({ onPick, heldIds, busy }) => (
  <InkPicker
    label="Add an ink you own"
    hint="Type part of an ink's name or its brand; Enter adds the highlighted ink."
    chosenIds={[...heldIds]}
    chosenLabel="in your stash"
    // While an add is on its way, typing goes on but a second pick waits.
    onPick={(ink) => {
      if (!busy) onPick(ink);
    }}
  />
);

export default function StashPage() {
  return (
    <RequireRole>
      {() => (
        <>
          <PageHeader
            documentTitle="Your stash"
            eyebrow="Your stash"
            title="The inks you own"
            intro="Keep your stash here so you never buy an ink twice, see which inks are running low, and find strips you can blend with what you have."
          />
          <MyStash inkPicker={stashPicker} />
          <section aria-labelledby="stash-chart" className="mt-10 flex flex-col gap-2 border-t border-rule pt-6">
            <h2 id="stash-chart" className="text-xl font-bold">
              Stash chart
            </h2>
            <p className="max-w-prose text-ink-soft">
              Every ink you own as a labelled box with its catalogue colour, grouped by hue, and an empty box beside it to
              swatch the real ink.
            </p>
            <PrintLinks href="/api/stash/chart.pdf" what="your stash chart" />
          </section>
        </>
      )}
    </RequireRole>
  );
}
