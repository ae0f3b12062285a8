// Plane geometry for the scene generator and its scoring: homographies, convex polygons, corner order.
// The 4-point homography is the direct linear transform of Hartley & Zisserman, "Multiple View
// Geometry in Computer Vision" (2nd ed., §4.1), solved exactly for four correspondences.

export type Pt = [number, number];
export type Quad = [Pt, Pt, Pt, Pt];
/** Row-major 3×3. */
export type Mat3 = number[];

export function mul3(a: Mat3, b: Mat3): Mat3 {
  const o = new Array(9).fill(0);
  for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) for (let k = 0; k < 3; k++) o[i * 3 + j] += a[i * 3 + k] * b[k * 3 + j];
  return o;
}

export function inv3(m: Mat3): Mat3 {
  const [a, b, c, d, e, f, g, h, i] = m;
  const A = e * i - f * h;
  const B = -(d * i - f * g);
  const C = d * h - e * g;
  const det = a * A + b * B + c * C;
  if (Math.abs(det) < 1e-300) throw new Error("singular matrix");
  return [A / det, -(b * i - c * h) / det, (b * f - c * e) / det, B / det, (a * i - c * g) / det, -(a * f - c * d) / det, C / det, -(a * h - b * g) / det, (a * e - b * d) / det];
}

export function applyH(h: Mat3, p: Pt): Pt {
  const w = h[6] * p[0] + h[7] * p[1] + h[8];
  return [(h[0] * p[0] + h[1] * p[1] + h[2]) / w, (h[3] * p[0] + h[4] * p[1] + h[5]) / w];
}

/** Homography taking the unit square (0,0),(1,0),(1,1),(0,1) to the quad q (Heckbert's closed form of the 4-point DLT). */
export function squareToQuad(q: Quad): Mat3 {
  const [[x0, y0], [x1, y1], [x2, y2], [x3, y3]] = q;
  const dx1 = x1 - x2;
  const dx2 = x3 - x2;
  const dy1 = y1 - y2;
  const dy2 = y3 - y2;
  const sx = x0 - x1 + x2 - x3;
  const sy = y0 - y1 + y2 - y3;
  const den = dx1 * dy2 - dx2 * dy1;
  const g = (sx * dy2 - dx2 * sy) / den;
  const h = (dx1 * sy - sx * dy1) / den;
  return [x1 - x0 + g * x1, x3 - x0 + h * x3, x0, y1 - y0 + g * y1, y3 - y0 + h * y3, y0, g, h, 1];
}

export function polygonArea(p: Pt[]): number {
  let s = 0;
  for (let i = 0; i < p.length; i++) {
    const [x0, y0] = p[i];
    const [x1, y1] = p[(i + 1) % p.length];
    s += x0 * y1 - x1 * y0;
  }
  return s / 2;
}

/** Sutherland–Hodgman clipping of a polygon by a convex polygon (either winding). */
export function clipConvex(subject: Pt[], clip: Pt[]): Pt[] {
  const sign = polygonArea(clip) >= 0 ? 1 : -1;
  let out = subject.slice();
  for (let i = 0; i < clip.length && out.length; i++) {
    const a = clip[i];
    const b = clip[(i + 1) % clip.length];
    const side = (p: Pt) => sign * ((b[0] - a[0]) * (p[1] - a[1]) - (b[1] - a[1]) * (p[0] - a[0]));
    const input = out;
    out = [];
    for (let j = 0; j < input.length; j++) {
      const p = input[j];
      const q = input[(j + 1) % input.length];
      const sp = side(p);
      const sq = side(q);
      if (sp >= 0) out.push(p);
      if ((sp >= 0) !== (sq >= 0)) {
        const t = sp / (sp - sq);
        out.push([p[0] + t * (q[0] - p[0]), p[1] + t * (q[1] - p[1])]);
      }
    }
  }
  return out;
}

export function intersectionArea(a: Pt[], b: Pt[]): number {
  const c = clipConvex(a, b);
  return c.length < 3 ? 0 : Math.abs(polygonArea(c));
}

export function iou(a: Pt[], b: Pt[]): number {
  const i = intersectionArea(a, b);
  const u = Math.abs(polygonArea(a)) + Math.abs(polygonArea(b)) - i;
  return u > 0 ? i / u : 0;
}

export function centroid(p: Pt[]): Pt {
  let x = 0;
  let y = 0;
  for (const q of p) {
    x += q[0];
    y += q[1];
  }
  return [x / p.length, y / p.length];
}

export function insideConvex(pt: Pt, poly: Pt[]): boolean {
  let sgn = 0;
  for (let i = 0; i < poly.length; i++) {
    const a = poly[i];
    const b = poly[(i + 1) % poly.length];
    const c = (b[0] - a[0]) * (pt[1] - a[1]) - (b[1] - a[1]) * (pt[0] - a[0]);
    if (c === 0) continue;
    const s = Math.sign(c);
    if (sgn === 0) sgn = s;
    else if (s !== sgn) return false;
  }
  return true;
}

/**
 * Orders a strip's corners as the project does (server/analysis/types.ts `Outline`): p0→p1 along
 * the strip from its start (left end if the strip runs more horizontally on screen, top end if more
 * vertically), p1→p2 across the far end, clockwise on screen (image y grows downward).
 * `q` must list the corners going round the strip with q0→q1 along a long side.
 */
export function orderStripCorners(q: Quad): { corners: Quad; orientation: "horizontal" | "vertical"; reversed: boolean } {
  const endA: Pt = [(q[0][0] + q[3][0]) / 2, (q[0][1] + q[3][1]) / 2]; // the end at q0/q3
  const endB: Pt = [(q[1][0] + q[2][0]) / 2, (q[1][1] + q[2][1]) / 2];
  const dx = endB[0] - endA[0];
  const dy = endB[1] - endA[1];
  const orientation = Math.abs(dx) >= Math.abs(dy) ? "horizontal" : "vertical";
  const reversed = orientation === "horizontal" ? dx < 0 : dy < 0;
  // Start end first: [start corner on one side, far corner same side, far corner other side, start other side].
  let c: Quad = reversed ? [q[1], q[0], q[3], q[2]] : [q[0], q[1], q[2], q[3]];
  if (polygonArea(c) < 0) c = [c[3], c[2], c[1], c[0]]; // y-down: positive shoelace = clockwise on screen
  return { corners: c, orientation, reversed };
}
