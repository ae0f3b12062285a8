import { Link } from "react-router";
import { thumbHashToDataURL } from "thumbhash";
import type { Strip } from "../../../../shared/schemas/strips";
import { ColourSwatch } from "../../../components/ui/colour-swatch";
import { colourWords } from "../../../lib/colour-words";
import { formatHex } from "../../../lib/format";

// The server makes each photo's derivatives at these long edges (never enlarged).
const THUMB_LONG = 480;
const DISPLAY_LONG = 1600;

const placeholders = new Map<string, string | null>();

/** The photo's ThumbHash (base64) as a blurred PNG to show while it loads; null if unreadable. */
function placeholderUrl(base64: string): string | null {
  if (!base64) return null;
  let url = placeholders.get(base64);
  if (url === undefined) {
    try {
      url = thumbHashToDataURL(Uint8Array.from(atob(base64), (c) => c.charCodeAt(0)));
    } catch {
      url = null; // only the blurred preview is lost; the photo still loads
    }
    placeholders.set(base64, url);
  }
  return url;
}

function stripAlt(strip: Pick<Strip, "inks">): string {
  return strip.inks.length ? `Blended strip: ${strip.inks.map((i) => i.name).join(", ")}` : "Blended strip";
}

/**
 * A saved strip as a full-width band (the photo fills a wide, short frame; a vertical strip is
 * turned to read left to right), its title and author, then its ink chips underneath.
 */
export function BinderStrip({ strip, eager = false }: { strip: Strip; eager?: boolean }) {
  const { images } = strip;
  const placeholder = placeholderUrl(images.placeholder);
  const long = Math.max(images.width, images.height) || DISPLAY_LONG;
  return (
    <div className="flex flex-col gap-2.5">
      <div className="strip-frame rounded-md bg-paper-shade">
        <img
          src={images.display}
          srcSet={`${images.thumb} ${Math.min(THUMB_LONG, long)}w, ${images.display} ${long}w`}
          sizes="(min-width: 66rem) 62rem, calc(100vw - 2.5rem)"
          width={images.width || undefined}
          height={images.height || undefined}
          loading={eager ? "eager" : "lazy"}
          decoding="async"
          alt={stripAlt(strip)}
          className={strip.orientation === "vertical" ? "strip-fill-turned" : "strip-fill"}
          style={placeholder ? { backgroundImage: `url("${placeholder}")` } : undefined}
        />
      </div>
      <div className="flex flex-wrap items-baseline justify-between gap-x-4 gap-y-1 px-1">
        <h3 className="text-lg leading-snug font-bold">
          <Link to={`/strips/${strip.id}`} className="text-ink hover:text-accent hover:underline">
            {strip.title}
          </Link>
        </h3>
        <p className="text-sm text-ink-soft">
          by{" "}
          <Link to={`/members/${strip.author.id}`} className="font-bold text-accent hover:underline">
            {strip.author.name}
          </Link>
        </p>
      </div>
      <ol aria-label={`Inks of ${strip.title}, in order`} className="grid grid-cols-2 gap-1.5 px-1 sm:flex sm:flex-wrap sm:gap-2">
        {strip.inks.map((ink, i) => (
          <li key={ink.id} className="min-w-0">
            <Link
              to={`/inks/${ink.id}`}
              className="relative flex min-h-11 items-center gap-2 overflow-hidden rounded-full border border-rule bg-paper py-1 pr-3 pl-1 hover:border-ink-muted hover:bg-paper-shade"
            >
              <ColourSwatch hex={ink.hex} className="h-7 w-7 rounded-full" />
              <span className="min-w-0 leading-tight">
                <span className="sr-only">{i + 1}. </span>
                <span className="block truncate text-sm font-bold">{ink.name}</span>
                <span className="block truncate text-xs text-ink-soft" title={`${colourWords(ink.lab)} ${formatHex(ink.hex)}`}>
                  {ink.brand} · {colourWords(ink.lab)}
                  <span className="sr-only"> {formatHex(ink.hex)}</span>
                </span>
              </span>
            </Link>
          </li>
        ))}
      </ol>
    </div>
  );
}
