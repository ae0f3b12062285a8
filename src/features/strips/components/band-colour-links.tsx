import { useId } from "react";
import { Link } from "react-router";
import type { StripBand } from "../../../../shared/schemas/strips";
import { ColourSwatch } from "../../../components/ui/colour-swatch";
import { colourWords } from "../../../lib/colour-words";
import { formatHex } from "../../../lib/format";
import { colourSearchHref } from "../sample-colour";

/**
 * One "Find strips with this colour" link per band (its measured colour): the way to search by
 * a strip's colours without pointing at the photo.
 */
export function BandColourLinks({ bands }: { bands: Pick<StripBand, "index" | "hex" | "lab">[] }) {
  const titleId = useId();
  if (bands.length === 0) return null;
  return (
    <div className="flex flex-col gap-2">
      <h3 id={titleId} className="mt-2 text-lg font-bold">
        Find strips with a band's colour
      </h3>
      <ul className="grid gap-2 sm:grid-cols-2 lg:grid-cols-3" aria-labelledby={titleId}>
        {bands.map((band) => {
          const words = colourWords(band.lab);
          return (
            <li key={band.index} className="flex items-center gap-3 rounded-lg border border-rule bg-card px-3 py-2">
              <ColourSwatch hex={band.hex} className="h-9 w-9 rounded-full" />
              <p className="min-w-0 flex-1 leading-snug">
                <span className="block text-sm text-ink-soft">
                  Band {band.index + 1} · {words} · <span className="tabular-nums">{formatHex(band.hex)}</span>
                </span>
                <Link to={colourSearchHref(band.hex)} className="inline-flex min-h-9 items-center font-bold text-accent underline hover:text-accent-deep">
                  Find strips with this colour
                  <span className="sr-only">
                    {" "}
                    (band {band.index + 1}, {words})
                  </span>
                </Link>
              </p>
            </li>
          );
        })}
      </ul>
    </div>
  );
}
