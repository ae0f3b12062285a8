export { ImageError, type ImageErrorCode } from "./image-error";
export { sniffImageType, sniffImageBytes, type ImageType, type SniffResult } from "./sniff-image-type";
export { readHeaderInfo, type HeaderInfo } from "./header-info";
export {
  readImage,
  readImageBytes,
  decodeImageBytes,
  downscaleImage,
  DEFAULT_MAX_BYTES,
  DEFAULT_MAX_PIXELS,
  type DecodedImage,
  type ReadImageOptions,
} from "./read-image";
export {
  makeDerivatives,
  saveDerivatives,
  writeDerivatives,
  encodeWebp,
  smallCopy,
  makePlaceholder,
  makePhash,
  phashDistance,
  DISPLAY_LONG_EDGE,
  THUMB_LONG_EDGE,
  type Derivatives,
  type DerivativeInfo,
  type EncodedImage,
} from "./derivatives";
export { useSafeSharp, ALLOWED_LOADERS } from "./safe-sharp";
export { cropDerivatives, type PixelBox } from "./crop";
