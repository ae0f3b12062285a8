import type { ReactNode } from "react";
import { placeholderAspect, placeholderUrl } from "../placeholder";

type PhotoFrameProps = {
  src: string;
  srcSet?: string;
  sizes?: string;
  alt: string;
  /** ThumbHash (base64) shown while the photo loads; also gives the shape before it arrives. */
  placeholder: string;
  width?: number;
  height?: number;
  /** Tallest the photo may be, as a CSS length (a portrait photo must not fill three screens). */
  maxHeight?: string;
  /** Drawn over the photo, exactly covering it (outlines, markers). */
  overlay?: ReactNode;
  /** Shown directly under the photo, at the photo's width (the band bar). */
  footer?: ReactNode;
  onLoad?: (size: { width: number; height: number }) => void;
  className?: string;
};

/**
 * The whole photo at its own shape, never cropped, so that positions given as fractions of the
 * image (bands, a tapped white point) land on the same spot of the box drawn over it.
 */
export function PhotoFrame({ src, srcSet, sizes, alt, placeholder, width, height, maxHeight = "70vh", overlay, footer, onLoad, className = "" }: PhotoFrameProps) {
  const blur = placeholderUrl(placeholder);
  const aspect = width && height ? width / height : (placeholderAspect(placeholder) ?? 1.5);
  const w = width || 1000;
  const h = height || Math.round(1000 / aspect);
  return (
    <div className={`mx-auto flex flex-col gap-2 ${className}`} style={{ width: `min(100%, calc(${maxHeight} * ${aspect.toFixed(4)}))` }}>
      <div className="relative">
        <img
          src={src}
          srcSet={srcSet}
          sizes={sizes}
          alt={alt}
          width={w}
          height={h}
          decoding="async"
          onLoad={(e) => onLoad?.({ width: e.currentTarget.naturalWidth, height: e.currentTarget.naturalHeight })}
          className="block h-auto w-full rounded-md bg-paper-shade bg-cover bg-center"
          style={blur ? { backgroundImage: `url("${blur}")` } : undefined}
        />
        {overlay}
      </div>
      {footer}
    </div>
  );
}
