import { hexToLab } from "../../../../shared/colour";
import { ColourSwatch } from "../../../components/ui/colour-swatch";
import { colourWords } from "../../../lib/colour-words";

/** The colours a search asks for, each with its words and a remove button. */
export function ChosenColours({ colours, onRemove }: { colours: readonly string[]; onRemove: (hex: string) => void }) {
  if (!colours.length) return null;
  return (
    <ul aria-label="Colours in this search" className="flex flex-col gap-2">
      {colours.map((hex) => {
        const words = colourWords(hexToLab(hex));
        return (
          <li key={hex} className="flex items-center gap-3 rounded-lg border border-rule bg-card p-1.5 pr-1">
            <ColourSwatch hex={hex} className="h-9 w-12" />
            <span className="min-w-0 flex-1 leading-tight">
              <span className="block font-bold">{words}</span>
              <span className="block font-mono text-sm text-ink-soft">{hex}</span>
            </span>
            <button
              type="button"
              onClick={() => onRemove(hex)}
              className="grid min-h-11 min-w-11 place-items-center rounded-md text-ink-soft hover:bg-paper-shade hover:text-ink"
              aria-label={`Remove the colour ${words} ${hex}`}
            >
              <span aria-hidden="true" className="text-xl leading-none">×</span>
            </button>
          </li>
        );
      })}
    </ul>
  );
}
