/** The long edges the server makes its derivatives at (thumb 480, display 1600; never enlarged). */
const THUMB_LONG = 480;
const DISPLAY_LONG = 1600;

/**
 * srcset for a photo shown upright: each file's real width, from the photo's shape. `long` is the
 * display file's long edge when known (a small original is not enlarged).
 */
export function uprightSrcSet(images: { thumb: string; display: string }, aspect: number, long = DISPLAY_LONG): string {
  const widthShare = aspect >= 1 ? 1 : aspect;
  const thumbW = Math.max(1, Math.round(Math.min(THUMB_LONG, long) * widthShare));
  const displayW = Math.max(1, Math.round(long * widthShare));
  return `${images.thumb} ${thumbW}w, ${images.display} ${displayW}w`;
}

/**
 * srcset for a photo laid along a wide frame (a vertical strip turned a quarter): its long edge
 * runs along the frame's width, so the long edges are the widths that matter.
 */
export function bandSrcSet(images: { thumb: string; display: string }, long = DISPLAY_LONG): string {
  return `${images.thumb} ${Math.min(THUMB_LONG, long)}w, ${images.display} ${long}w`;
}
