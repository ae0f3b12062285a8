import { Link } from "react-router";
import { ColourSwatch } from "../../../components/ui/colour-swatch";
import { colourWords } from "../../../lib/colour-words";
import { formatHex, plural } from "../../../lib/format";
import { useStash } from "../api/get-stash";

/** A compact strip: past this many, the stash page has the rest. */
const SHOWN = 60;

/**
 * The signed-in member's stash as one compact row of swatches (for the account page), each with
 * its ink's name, brand, colour words and hex for screen readers and on hover. Nothing for
 * visitors.
 */
export function StashSwatches() {
  const stash = useStash();
  // Until the answer comes it is not known whether this is a visitor: show nothing rather than guess.
  if (stash.isPending) return null;
  if (stash.isError) return <p className="text-ink-muted">Your stash could not be loaded just now.</p>;
  const items = stash.data;
  if (!items) return null;
  if (items.length === 0) {
    return (
      <p className="text-ink-soft">
        Your stash is empty. <Link to="/stash" className="font-bold text-accent underline">Add the inks you own</Link> to see
        what you can blend with them.
      </p>
    );
  }
  const low = items.filter((i) => i.runningLow).length;
  const shown = items.slice(0, SHOWN);
  return (
    <div className="flex flex-col gap-2">
      <ul aria-label="Inks in your stash" className="flex flex-wrap gap-1">
        {shown.map(({ ink, runningLow }) => {
          const words = `${ink.name}, ${ink.brand.name}: ${colourWords(ink.lab)} ${formatHex(ink.hex)}${runningLow ? ", running low" : ""}`;
          return (
            <li key={ink.id} title={words} className="relative">
              <ColourSwatch hex={ink.hex} className="h-8 w-8 rounded" />
              {runningLow && (
                <span aria-hidden="true" className="absolute -right-0.5 -bottom-0.5 h-2.5 w-2.5 rounded-full border-2 border-card bg-warn" />
              )}
              <span className="sr-only">{words}</span>
            </li>
          );
        })}
      </ul>
      <p className="text-sm text-ink-soft">
        {plural(items.length, "ink")}
        {items.length > shown.length && ` (the first ${shown.length} shown)`}
        {low > 0 && (
          <>
            {" "}
            · {low} running low <span aria-hidden="true">(marked with a dot)</span>
          </>
        )}{" "}
        ·{" "}
        <Link to="/stash" className="font-bold text-accent underline">
          Open your stash
        </Link>
      </p>
    </div>
  );
}
