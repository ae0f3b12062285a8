// Finds the inked strip in a corrected CIELAB image: coarse ink blocks → largest elongated
// component → principal axis (PCA) → ends and edges refined at pixel level.
import type { LabImage } from "./corrected-lab";
import { NoStripError } from "./no-strip-error";
import type { Orientation } from "./types";

export type StripGeometry = {
  orientation: Orientation;
  /** Pixel position of the strip's start (left or top end), on its centre line. */
  origin: [number, number];
  /** Unit vector along the strip, pointing from start to end. */
  along: [number, number];
  /** Unit vector across the strip. */
  across: [number, number];
  /** Length and thickness in pixels. */
  length: number;
  thickness: number;
  /** Tilt from the nearest image axis, degrees. */
  tiltDegrees: number;
};

// Thresholds in ΔE*ab from the corrected paper white (L* = 100). Ours, chosen on synthetic photos.
export const INK_CORE = 10; // a block this far from white is surely ink
export const INK_EDGE = 3; // the strip goes on while its colour stays this far from white
const MIN_LENGTH_PX = 60;
const MIN_THICKNESS_PX = 8;
const MIN_ASPECT = 1.5;

export function inkness(lab: Float32Array, i: number): number {
  const dl = Math.min(0, lab[i] - 100);
  return Math.sqrt(dl * dl + lab[i + 1] * lab[i + 1] + lab[i + 2] * lab[i + 2]);
}

type Component = { blocks: number[]; touchesEdges: number };

function components(mask: Uint8Array, gw: number, gh: number): Component[] {
  const seen = new Uint8Array(mask.length);
  const out: Component[] = [];
  const stack: number[] = [];
  for (let start = 0; start < mask.length; start++) {
    if (!mask[start] || seen[start]) continue;
    const blocks: number[] = [];
    let edges = 0;
    seen[start] = 1;
    stack.push(start);
    while (stack.length) {
      const p = stack.pop()!;
      blocks.push(p);
      const x = p % gw;
      const y = (p - x) / gw;
      if (x === 0) edges |= 1;
      if (x === gw - 1) edges |= 2;
      if (y === 0) edges |= 4;
      if (y === gh - 1) edges |= 8;
      const nb = [x > 0 ? p - 1 : -1, x < gw - 1 ? p + 1 : -1, y > 0 ? p - gw : -1, y < gh - 1 ? p + gw : -1];
      for (const q of nb) {
        if (q >= 0 && mask[q] && !seen[q]) {
          seen[q] = 1;
          stack.push(q);
        }
      }
    }
    out.push({ blocks, touchesEdges: ((edges & 1) + ((edges >> 1) & 1) + ((edges >> 2) & 1) + ((edges >> 3) & 1)) });
  }
  return out;
}

function median(values: number[]): number {
  if (values.length === 0) return 0;
  const s = Float64Array.from(values).sort();
  const m = s.length >> 1;
  return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2;
}

/** Median inkness across the strip's inner width at distance u along it. */
function columnInkness(img: LabImage, origin: [number, number], along: [number, number], across: [number, number], u: number, halfWidth: number): number | null {
  const vals: number[] = [];
  const n = Math.max(5, Math.min(31, Math.round(halfWidth)));
  for (let k = 0; k < n; k++) {
    const v = -halfWidth + (2 * halfWidth * (k + 0.5)) / n;
    const x = Math.round(origin[0] + along[0] * u + across[0] * v);
    const y = Math.round(origin[1] + along[1] * u + across[1] * v);
    if (x < 0 || y < 0 || x >= img.width || y >= img.height) continue;
    vals.push(inkness(img.lab, (y * img.width + x) * 3));
  }
  return vals.length >= 3 ? median(vals) : null;
}

/** Walks from u outward (step ±1 px) while the strip's colour is distinct from paper. */
function extendEnd(img: LabImage, origin: [number, number], along: [number, number], across: [number, number], u: number, dir: 1 | -1, halfWidth: number): number {
  let last = u;
  let misses = 0;
  for (let t = u; ; t += dir) {
    const k = columnInkness(img, origin, along, across, t, halfWidth);
    if (k === null) break;
    if (k >= INK_EDGE) {
      last = t;
      misses = 0;
    } else if (++misses >= 3) break;
  }
  return last;
}

/** Fraction of positions along the strip whose colour at offset v is ink. */
function acrossCoverage(img: LabImage, origin: [number, number], along: [number, number], across: [number, number], u0: number, u1: number, v: number): number {
  let ink = 0;
  let total = 0;
  const n = 60;
  for (let k = 0; k < n; k++) {
    const u = u0 + ((u1 - u0) * (k + 0.5)) / n;
    const x = Math.round(origin[0] + along[0] * u + across[0] * v);
    const y = Math.round(origin[1] + along[1] * u + across[1] * v);
    if (x < 0 || y < 0 || x >= img.width || y >= img.height) continue;
    total++;
    if (inkness(img.lab, (y * img.width + x) * 3) >= 6) ink++;
  }
  return total ? ink / total : 0;
}

function wholeImageStrip(img: LabImage): StripGeometry {
  const horizontal = img.width >= img.height;
  return horizontal
    ? { orientation: "horizontal", origin: [0, img.height / 2], along: [1, 0], across: [0, 1], length: img.width, thickness: img.height, tiltDegrees: 0 }
    : { orientation: "vertical", origin: [img.width / 2, 0], along: [0, 1], across: [1, 0], length: img.height, thickness: img.width, tiltDegrees: 0 };
}

export function findStrip(img: LabImage): StripGeometry {
  const { width: w, height: h, lab } = img;
  const bs = Math.max(2, Math.round(Math.max(w, h) / 250));
  const gw = Math.floor(w / bs);
  const gh = Math.floor(h / bs);
  const mask = new Uint8Array(gw * gh);
  for (let gy = 0; gy < gh; gy++) {
    for (let gx = 0; gx < gw; gx++) {
      let sl = 0;
      let sa = 0;
      let sb = 0;
      for (let y = gy * bs; y < (gy + 1) * bs; y++) {
        for (let x = gx * bs; x < (gx + 1) * bs; x++) {
          const i = (y * w + x) * 3;
          sl += lab[i];
          sa += lab[i + 1];
          sb += lab[i + 2];
        }
      }
      const n = bs * bs;
      const dl = Math.min(0, sl / n - 100);
      if (Math.sqrt(dl * dl + (sa / n) ** 2 + (sb / n) ** 2) >= INK_CORE) mask[gy * gw + gx] = 1;
    }
  }
  const comps = components(mask, gw, gh).filter((c) => c.blocks.length >= 12);
  if (comps.length === 0) throw new NoStripError("no_ink");
  comps.sort((a, b) => b.blocks.length - a.blocks.length);
  const main = comps[0];

  // A component that fills the frame: the photo is a tight crop of the strip itself.
  if (main.blocks.length > 0.6 * gw * gh) {
    if (Math.max(w, h) / Math.min(w, h) >= 1.8) return wholeImageStrip(img);
    throw new NoStripError("not_strip_shaped");
  }

  // Principal axis of the component's blocks.
  let mx = 0;
  let my = 0;
  for (const p of main.blocks) {
    mx += ((p % gw) + 0.5) * bs;
    my += (Math.floor(p / gw) + 0.5) * bs;
  }
  mx /= main.blocks.length;
  my /= main.blocks.length;
  let sxx = 0;
  let syy = 0;
  let sxy = 0;
  for (const p of main.blocks) {
    const dx = ((p % gw) + 0.5) * bs - mx;
    const dy = (Math.floor(p / gw) + 0.5) * bs - my;
    sxx += dx * dx;
    syy += dy * dy;
    sxy += dx * dy;
  }
  const theta = 0.5 * Math.atan2(2 * sxy, sxx - syy); // major axis angle, (-90°, 90°]
  let along: [number, number] = [Math.cos(theta), Math.sin(theta)];
  const horizontal = Math.abs(along[0]) >= Math.abs(along[1]);
  // Point "along" left→right for horizontal strips, top→bottom for vertical ones.
  if ((horizontal && along[0] < 0) || (!horizontal && along[1] < 0)) along = [-along[0], -along[1]];
  const across: [number, number] = [-along[1], along[0]];

  // Extents of the component in strip coordinates.
  const us: number[] = [];
  const vs: number[] = [];
  for (const p of main.blocks) {
    const dx = ((p % gw) + 0.5) * bs - mx;
    const dy = (Math.floor(p / gw) + 0.5) * bs - my;
    us.push(dx * along[0] + dy * along[1]);
    vs.push(dx * across[0] + dy * across[1]);
  }
  us.sort((a, b) => a - b);
  vs.sort((a, b) => a - b);
  const q = (s: number[], f: number) => s[Math.min(s.length - 1, Math.max(0, Math.round(f * (s.length - 1))))];
  let u0 = q(us, 0.002) - bs / 2;
  let u1 = q(us, 0.998) + bs / 2;
  let v0 = q(vs, 0.01) - bs / 2;
  let v1 = q(vs, 0.99) + bs / 2;
  const centre: [number, number] = [mx, my];

  // Refine the edges across: where at least half the positions along the strip are ink.
  {
    const lo = v0 - 2 * bs;
    const hi = v1 + 2 * bs;
    const cov: { v: number; c: number }[] = [];
    for (let v = lo; v <= hi; v += 0.5) cov.push({ v, c: acrossCoverage(img, centre, along, across, u0 + 0.1 * (u1 - u0), u1 - 0.1 * (u1 - u0), v) });
    const inside = cov.filter((e) => e.c >= 0.5);
    if (inside.length > 0) {
      v0 = inside[0].v;
      v1 = inside[inside.length - 1].v;
    }
  }
  const vMid = (v0 + v1) / 2;
  const thickness = v1 - v0;
  const mid: [number, number] = [centre[0] + across[0] * vMid, centre[1] + across[1] * vMid];
  const half = Math.max(1, 0.3 * thickness);

  // Refine the ends along: go on while the colour stays off-white (a near-white patch included).
  u0 = extendEnd(img, mid, along, across, u0 + bs, -1, half) - 0.5;
  u1 = extendEnd(img, mid, along, across, u1 - bs, 1, half) + 0.5;
  const length = u1 - u0;

  if (length < MIN_LENGTH_PX || thickness < MIN_THICKNESS_PX) throw new NoStripError("too_small");
  if (length / thickness < MIN_ASPECT) throw new NoStripError("not_strip_shaped");

  const angle = (Math.atan2(along[1], along[0]) * 180) / Math.PI;
  const tilt = horizontal ? angle : angle - 90;
  return {
    orientation: horizontal ? "horizontal" : "vertical",
    origin: [mid[0] + along[0] * u0, mid[1] + along[1] * u0],
    along,
    across,
    length,
    thickness,
    tiltDegrees: tilt,
  };
}
