import type { Strip } from "../../../../shared/schemas/strips";
import { bandSrcSet } from "../image-sources";
import { placeholderUrl } from "../placeholder";
import { stripAltFor } from "../strip-words";

type StripBandImageProps = {
  strip: Pick<Strip, "images" | "orientation" | "inks">;
  /** The frame's width on screen, for choosing thumb or display. */
  sizes?: string;
  /** Above the fold: load at once. */
  eager?: boolean;
};

/**
 * A strip as a full-width band: the photo fills a wide, short frame, with its ThumbHash
 * placeholder behind it while it loads. Vertical strips are turned so they read left to right.
 */
export function StripBandImage({ strip, sizes = "(min-width: 66rem) 62rem, calc(100vw - 2.5rem)", eager = false }: StripBandImageProps) {
  const { images } = strip;
  const placeholder = placeholderUrl(images.placeholder);
  const turned = strip.orientation === "vertical";
  return (
    <div className="strip-frame rounded-md bg-paper-shade">
      <img
        src={images.display}
        srcSet={bandSrcSet(images, Math.max(images.width, images.height) || undefined)}
        sizes={sizes}
        width={images.width || undefined}
        height={images.height || undefined}
        loading={eager ? "eager" : "lazy"}
        decoding="async"
        alt={stripAltFor(strip)}
        className={turned ? "strip-fill-turned" : "strip-fill"}
        style={placeholder ? { backgroundImage: `url("${placeholder}")` } : undefined}
      />
    </div>
  );
}
