// A strip's outline as four corners: fitting it to a found region, putting its corners in the
// order the API uses, and mapping positions on the straightened strip back into the photo.
import { approxPolygon, convexHull, minAreaRect, perspectiveTransform, type Point } from "./vision";
import type { Orientation } from "./types";

export type { Point };

/** Shoelace area of a simple polygon (absolute). */
export function polygonArea(pts: readonly Point[]): number {
  let s = 0;
  for (let i = 0; i < pts.length; i++) {
    const a = pts[i];
    const b = pts[(i + 1) % pts.length];
    s += a[0] * b[1] - b[0] * a[1];
  }
  return Math.abs(s) / 2;
}

const dist = (a: Point, b: Point) => Math.hypot(a[0] - b[0], a[1] - b[1]);

function isConvex(q: readonly Point[]): boolean {
  let sign = 0;
  for (let i = 0; i < 4; i++) {
    const a = q[i];
    const b = q[(i + 1) % 4];
    const c = q[(i + 2) % 4];
    const cross = (b[0] - a[0]) * (c[1] - b[1]) - (b[1] - a[1]) * (c[0] - b[0]);
    if (Math.abs(cross) < 1e-9) continue;
    if (sign === 0) sign = Math.sign(cross);
    else if (Math.sign(cross) !== sign) return false;
  }
  return true;
}

/**
 * Four corners around a region's pixels: its convex hull simplified by Douglas–Peucker until four
 * vertices remain (this keeps a trapezoid a trapezoid under perspective), or the minimum-area
 * rotated rectangle when the hull does not simplify to a convex quadrilateral covering it.
 */
export function fitQuad(pts: readonly Point[]): { quad: Point[]; hullArea: number } {
  const hull = convexHull(pts);
  const hullArea = polygonArea(hull);
  let perimeter = 0;
  for (let i = 0; i < hull.length; i++) perimeter += dist(hull[i], hull[(i + 1) % hull.length]);
  for (let k = 1; k <= 12; k++) {
    const q = approxPolygon(hull, 0.01 * k * perimeter);
    if (q.length < 4) break;
    if (q.length === 4) {
      if (isConvex(q) && polygonArea(q) >= 0.9 * hullArea) return { quad: q, hullArea };
      break;
    }
  }
  return { quad: minAreaRect(hull), hullArea };
}

export type OrderedQuad = { corners: [Point, Point, Point, Point]; orientation: Orientation; length: number; thickness: number };

/**
 * Puts a quad's corners in the API's order: p0→p1 along the strip from its start (left end for a
 * strip nearer horizontal, top end nearer vertical), p1→p2 across the far end, then back; clockwise
 * on screen (y down).
 */
export function orderQuad(quad: readonly Point[]): OrderedQuad {
  let q = quad.slice(0, 4) as Point[];
  // Clockwise on screen: positive shoelace sum with y pointing down.
  let s = 0;
  for (let i = 0; i < 4; i++) s += q[i][0] * q[(i + 1) % 4][1] - q[(i + 1) % 4][0] * q[i][1];
  if (s < 0) q = [q[0], q[3], q[2], q[1]];
  // The long sides: whichever pair of opposite sides is longer.
  const side = (i: number) => dist(q[i], q[(i + 1) % 4]);
  const pairA = side(0) + side(2);
  const pairB = side(1) + side(3);
  if (pairB > pairA) q = [q[1], q[2], q[3], q[0]];
  // Now q0→q1 and q2→q3 are the long sides. Direction along the strip:
  const mid = (a: Point, b: Point): Point => [(a[0] + b[0]) / 2, (a[1] + b[1]) / 2];
  const startMid = mid(q[3], q[0]);
  const endMid = mid(q[1], q[2]);
  const dx = endMid[0] - startMid[0];
  const dy = endMid[1] - startMid[1];
  const horizontal = Math.abs(dx) >= Math.abs(dy);
  const backwards = horizontal ? dx < 0 : dy < 0;
  if (backwards) q = [q[2], q[3], q[0], q[1]];
  const length = (dist(q[0], q[1]) + dist(q[3], q[2])) / 2;
  const thickness = (dist(q[1], q[2]) + dist(q[3], q[0])) / 2;
  return { corners: q as [Point, Point, Point, Point], orientation: horizontal ? "horizontal" : "vertical", length, thickness };
}

/** Maps (s along 0–1, t across 0–1, t = 0 on the p0→p1 side) on the straightened strip into the photo. */
export type StripMap = (s: number, t: number) => Point;

export function stripMap(corners: readonly Point[]): StripMap {
  const m = perspectiveTransform(
    [
      [0, 0],
      [1, 0],
      [1, 1],
      [0, 1],
    ],
    corners,
  );
  return (s, t) => {
    const w = m[6] * s + m[7] * t + m[8];
    return [(m[0] * s + m[1] * t + m[2]) / w, (m[3] * s + m[4] * t + m[5]) / w];
  };
}

/** Reading order: rows top to bottom (strips whose vertical extents mostly overlap share a row), then left to right. */
export function readingOrder<T extends { corners: readonly Point[] }>(items: T[]): T[] {
  const box = (c: readonly Point[]) => {
    const ys = c.map((p) => p[1]);
    const xs = c.map((p) => p[0]);
    return { top: Math.min(...ys), bottom: Math.max(...ys), cx: xs.reduce((a, b) => a + b, 0) / 4, cy: ys.reduce((a, b) => a + b, 0) / 4 };
  };
  const withBox = items.map((it) => ({ it, b: box(it.corners) })).sort((a, b) => a.b.cy - b.b.cy);
  const rows: (typeof withBox)[] = [];
  for (const e of withBox) {
    const row = rows.find((r) =>
      r.some((o) => {
        const overlap = Math.min(o.b.bottom, e.b.bottom) - Math.max(o.b.top, e.b.top);
        return overlap > 0.5 * Math.min(o.b.bottom - o.b.top, e.b.bottom - e.b.top);
      }),
    );
    if (row) row.push(e);
    else rows.push([e]);
  }
  rows.sort((a, b) => Math.min(...a.map((e) => e.b.cy)) - Math.min(...b.map((e) => e.b.cy)));
  return rows.flatMap((r) => r.sort((a, b) => a.b.cx - b.b.cx).map((e) => e.it));
}
