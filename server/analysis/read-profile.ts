// The robust average the strip reading uses (read-strip.ts): the per-channel interquartile mean.
// Like a median it ignores specks and glare (they fall in the outer quarters), but it does not
// snap to one 8-bit step on dark colours.

/** Moves the k-th smallest of a[lo..hi] to a[k], smaller ones before it, larger after (Hoare's quickselect). */
function selectInPlace(a: Float64Array, k: number, lo: number, hi: number): void {
  while (hi > lo) {
    const pivot = a[(lo + hi) >> 1]!;
    let i = lo;
    let j = hi;
    while (i <= j) {
      while (a[i]! < pivot) i++;
      while (a[j]! > pivot) j--;
      if (i <= j) {
        const t = a[i]!;
        a[i] = a[j]!;
        a[j] = t;
        i++;
        j--;
      }
    }
    if (k <= j) hi = j;
    else if (k >= i) lo = i;
    else return;
  }
}

/**
 * Mean of the values between the 25th and 75th percentiles. Two selections instead of a sort:
 * after them a[lo..hi) holds exactly the values a sort would put there.
 */
export function interquartileMean(values: number[]): number {
  const a = Float64Array.from(values);
  const n = a.length;
  if (n === 0) return NaN;
  if (n < 4) return a.sort()[n >> 1]!;
  const lo = Math.floor(n / 4);
  const hi = n - lo;
  selectInPlace(a, lo, 0, n - 1);
  selectInPlace(a, hi - 1, lo, n - 1);
  let s = 0;
  for (let i = lo; i < hi; i++) s += a[i]!;
  return s / (hi - lo);
}
