import type { ColourBox } from "./colour-bounds";

// The cell grid of the colour index; the same numbers as migration 20261202_0006_search_index.
// cell = (lIdx * C_CELLS + cIdx) * H_CELLS + hIdx, so for one (L*, C*) cell the hues are one
// contiguous run of keys.
export const L_STEP = 5;
export const L_CELLS = 24;
export const C_STEP = 5;
export const C_CELLS = 64;
export const H_STEP = 5;
export const H_CELLS = 72;

const clamp = (i: number, n: number) => Math.min(Math.max(i, 0), n - 1);

/** The cell of a point, as the migration's triggers file it. */
export function cellOf(l: number, c: number, h: number) {
  const li = clamp(Math.trunc(l / L_STEP), L_CELLS);
  const ci = clamp(Math.trunc(c / C_STEP), C_CELLS);
  const hi = clamp(Math.trunc(h / H_STEP), H_CELLS);
  return (li * C_CELLS + ci) * H_CELLS + hi;
}

/** Runs of cell keys [from, to] that hold every point of the box. */
export function cellRuns(box: ColourBox): [number, number][] {
  // Math.floor on the (clamped) box edges: a point inside the box has an index between them.
  const l0 = clamp(Math.floor(box.lMin / L_STEP), L_CELLS);
  const l1 = clamp(Math.floor(box.lMax / L_STEP), L_CELLS);
  const c0 = clamp(Math.floor(box.cMin / C_STEP), C_CELLS);
  const c1 = clamp(Math.floor(box.cMax / C_STEP), C_CELLS);
  const h0 = clamp(Math.floor(box.hMin / H_STEP), H_CELLS);
  const h1 = clamp(Math.floor(box.hMax / H_STEP), H_CELLS);
  const runs: [number, number][] = [];
  for (let l = l0; l <= l1; l++) {
    for (let c = c0; c <= c1; c++) {
      const base = (l * C_CELLS + c) * H_CELLS;
      runs.push([base + h0, base + h1]);
    }
  }
  return runs;
}
