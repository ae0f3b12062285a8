import { Link } from "react-router";
import { describeDeltaE, hexToLab } from "../../../../shared/colour";
import type { ColourMatch, StripSearchResult } from "../../../../shared/schemas/search";
import type { Strip } from "../../../../shared/schemas/strips";
import { ColourSwatch } from "../../../components/ui/colour-swatch";
import { colourWords } from "../../../lib/colour-words";
import { BandBar } from "./band-bar";

type StripMatchProps = {
  strip: Strip;
  /** For a colour search: which band answered each colour, and how closely. */
  matches?: ColourMatch[];
  /** For a "one ink short" search: the ink the member does not own. */
  missingInkId?: number;
  /** …and the member's own ink closest to it, if it is a look-alike. */
  ownedLookAlike?: StripSearchResult["ownedLookAlike"];
};

/** Why a strip is in a search's results: the band that matched each colour, the ink still to buy. */
export function StripMatch({ strip, matches, missingInkId, ownedLookAlike }: StripMatchProps) {
  const missing = missingInkId === undefined ? undefined : strip.inks.find((i) => i.id === missingInkId);
  if (!matches?.length && !missing) return null;
  return (
    <div className="flex flex-col gap-2" data-testid="strip-match">
      {matches?.length ? (
        <>
          <BandBar bands={strip.bands} orientation={strip.orientation} highlight={matches.map((m) => m.bandIndex)} title="Matching band outlined" />
          <ul className="flex flex-col gap-1 text-sm">
            {matches.map((m) => {
              const band = strip.bands.find((b) => b.index === m.bandIndex);
              if (!band) return null;
              return (
                <li key={m.color} className="flex flex-wrap items-center gap-x-2 gap-y-1">
                  <ColourSwatch hex={band.hex} className="h-5 w-7" />
                  <span>
                    <span className="font-bold">Band {band.index + 1}</span>, {colourWords(band.lab)} <span className="font-mono">{band.hex}</span>:{" "}
                    <span className="font-bold">{describeDeltaE(m.deltaE)}</span> {describeDeltaE(m.deltaE) === "similar" ? "to" : "from"} your {colourWords(hexToLab(m.color))}{" "}
                    <span className="font-mono">{m.color}</span> <span className="text-ink-muted tabular-nums">(ΔE2000 {m.deltaE.toFixed(2)})</span>
                  </span>
                </li>
              );
            })}
          </ul>
        </>
      ) : null}
      {missing && (
        <p className="flex flex-wrap items-center gap-2 rounded-md bg-accent-soft px-2 py-1.5 text-sm">
          <ColourSwatch hex={missing.hex} className="h-5 w-7" />
          <span>
            One ink short: you do not own{" "}
            <Link to={`/inks/${missing.id}`} className="relative z-10 font-bold text-accent hover:underline">
              {missing.name}
            </Link>{" "}
            ({missing.brand}).
            {ownedLookAlike && (
              <>
                {" "}
                Your{" "}
                <Link to={`/inks/${ownedLookAlike.inkId}`} className="relative z-10 font-bold text-accent hover:underline">
                  {ownedLookAlike.name}
                </Link>{" "}
                is {ownedLookAlike.words === "similar" ? "similar to it" : `${ownedLookAlike.words} from it`}{" "}
                <span className="text-ink-muted tabular-nums">(ΔE2000 {ownedLookAlike.deltaE.toFixed(2)})</span>
                {ownedLookAlike.deltaE <= 2 ? " and may stand in." : "."}
              </>
            )}
          </span>
        </p>
      )}
    </div>
  );
}
