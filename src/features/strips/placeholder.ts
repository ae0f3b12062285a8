import { thumbHashToApproximateAspectRatio, thumbHashToDataURL } from "thumbhash";

const cache = new Map<string, { url: string; aspect: number } | null>();

function decode(base64: string): { url: string; aspect: number } | null {
  if (!base64) return null;
  const known = cache.get(base64);
  if (known !== undefined) return known;
  let result: { url: string; aspect: number } | null = null;
  try {
    const bytes = Uint8Array.from(atob(base64), (c) => c.charCodeAt(0));
    result = { url: thumbHashToDataURL(bytes), aspect: thumbHashToApproximateAspectRatio(bytes) };
  } catch {
    // A damaged placeholder only costs the blurred preview; the photo itself still loads.
    result = null;
  }
  cache.set(base64, result);
  return result;
}

/** The ThumbHash placeholder (base64) as a small PNG data URL, or null if it cannot be read. */
export function placeholderUrl(base64: string): string | null {
  return decode(base64)?.url ?? null;
}

/** Width ÷ height of the photo as the ThumbHash remembers it (approximate), or null. */
export function placeholderAspect(base64: string): number | null {
  return decode(base64)?.aspect ?? null;
}
