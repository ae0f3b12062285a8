// OpenCV (its official WebAssembly build, packaged on npm as @techstark/opencv-js) for the
// geometric steps of finding strips: morphology, connected components, convex hulls, polygon
// simplification, rotated rectangles and the four-point homography. Loaded once per thread
// (≈ 0.35 s); every Mat lives in the WebAssembly heap and must be deleted, so each helper here
// takes plain arrays in and gives plain arrays out. See docs/decisions/009-reading-real-photos.md.
import { createRequire } from "node:module";

/** The part of OpenCV's JavaScript API used here (the package's own types are very loose). */
type Mat = {
  rows: number;
  cols: number;
  data: Uint8Array;
  data32S: Int32Array;
  data32F: Float32Array;
  data64F: Float64Array;
  delete(): void;
};
type MatVector = { size(): number; get(i: number): Mat; delete(): void };
// OpenCV's JavaScript API is dynamic (Emscripten bindings); calls are typed at each use below.
// eslint-disable-next-line @typescript-eslint/no-explicit-any
type Cv = Record<string, any> & { onRuntimeInitialized?: () => void };

let cv: Cv | null = null;
let loading: Promise<void> | null = null;

/** Loads OpenCV once; every analysis entry point awaits this before reading a photo. */
export function loadVision(): Promise<void> {
  if (cv) return Promise.resolve();
  loading ??= (async () => {
    const require = createRequire(import.meta.url);
    // The Emscripten build installs process-wide handlers that turn any unhandled rejection into
    // an abort and print its whole 8 MB source on an uncaught error: take them off again.
    const before = {
      uncaughtException: new Set(process.listeners("uncaughtException")),
      unhandledRejection: new Set(process.listeners("unhandledRejection")),
    };
    let mod = require("@techstark/opencv-js") as Cv | Promise<Cv>;
    if (mod instanceof Promise) mod = await mod;
    const m = mod as Cv;
    if (!m.Mat) await new Promise<void>((resolve) => (m.onRuntimeInitialized = () => resolve()));
    for (const l of process.listeners("uncaughtException")) if (!before.uncaughtException.has(l)) process.removeListener("uncaughtException", l);
    for (const l of process.listeners("unhandledRejection")) if (!before.unhandledRejection.has(l)) process.removeListener("unhandledRejection", l);
    cv = m;
  })();
  return loading;
}

function vision(): Cv {
  if (!cv) throw new Error("OpenCV is not loaded: await loadVision() before analysing a photo.");
  return cv;
}

export function visionLoaded(): boolean {
  return cv !== null;
}

function withMats<T>(mats: { delete(): void }[], fn: () => T): T {
  try {
    return fn();
  } finally {
    for (const m of mats) m.delete();
  }
}

export type Point = [number, number];

/** A mask (0/1 bytes) opened or closed with an elliptical kernel of the given diameter. */
export function morph(mask: Uint8Array, width: number, height: number, op: "open" | "close" | "dilate" | "erode", size: number): Uint8Array {
  const c = vision();
  if (size < 2) return mask.slice();
  const src = c.matFromArray(height, width, c.CV_8UC1, mask);
  const dst = new c.Mat();
  const kernel = c.getStructuringElement(c.MORPH_ELLIPSE, new c.Size(size, size));
  return withMats([src, dst, kernel], () => {
    const code = { open: c.MORPH_OPEN, close: c.MORPH_CLOSE, dilate: c.MORPH_DILATE, erode: c.MORPH_ERODE }[op];
    c.morphologyEx(src, dst, code, kernel, new c.Point(-1, -1), 1, c.BORDER_CONSTANT, new c.Scalar(0));
    return Uint8Array.from((dst as Mat).data);
  });
}

export type Component = { label: number; area: number; left: number; top: number; width: number; height: number };

/** 8-connected components of a 0/1 mask: labels per pixel (0 = background) and each one's box. */
export function components(mask: Uint8Array, width: number, height: number): { labels: Int32Array; list: Component[] } {
  const c = vision();
  const src = c.matFromArray(height, width, c.CV_8UC1, mask);
  const labels = new c.Mat();
  const stats = new c.Mat();
  const centroids = new c.Mat();
  return withMats([src, labels, stats, centroids], () => {
    const n = c.connectedComponentsWithStats(src, labels, stats, centroids, 8, c.CV_32S) as number;
    const s = (stats as Mat).data32S;
    const list: Component[] = [];
    for (let i = 1; i < n; i++) {
      list.push({ label: i, left: s[i * 5], top: s[i * 5 + 1], width: s[i * 5 + 2], height: s[i * 5 + 3], area: s[i * 5 + 4] });
    }
    return { labels: Int32Array.from((labels as Mat).data32S), list };
  });
}

function pointsMat(c: Cv, pts: readonly Point[]) {
  return c.matFromArray(pts.length, 1, c.CV_32SC2, pts.flatMap((p) => [Math.round(p[0]), Math.round(p[1])]));
}

/** Convex hull of integer points (OpenCV's Sklansky implementation), in order. */
export function convexHull(pts: readonly Point[]): Point[] {
  const c = vision();
  const src = pointsMat(c, pts);
  const hull = new c.Mat();
  return withMats([src, hull], () => {
    c.convexHull(src, hull, false, true);
    const d = (hull as Mat).data32S;
    const out: Point[] = [];
    for (let i = 0; i < d.length; i += 2) out.push([d[i], d[i + 1]]);
    return out;
  });
}

/** Douglas–Peucker simplification of a closed polygon (Douglas & Peucker 1973). */
export function approxPolygon(pts: readonly Point[], epsilon: number): Point[] {
  const c = vision();
  const src = pointsMat(c, pts);
  const out = new c.Mat();
  return withMats([src, out], () => {
    c.approxPolyDP(src, out, epsilon, true);
    const d = (out as Mat).data32S;
    const res: Point[] = [];
    for (let i = 0; i < d.length; i += 2) res.push([d[i], d[i + 1]]);
    return res;
  });
}

/** The rotated rectangle of least area around the points (Freeman & Shapira 1975), as 4 corners. */
export function minAreaRect(pts: readonly Point[]): Point[] {
  const c = vision();
  const src = pointsMat(c, pts);
  return withMats([src], () => {
    const r = c.minAreaRect(src) as { center: { x: number; y: number }; size: { width: number; height: number }; angle: number };
    const a = (r.angle * Math.PI) / 180;
    const ux = [Math.cos(a), Math.sin(a)];
    const vy = [-Math.sin(a), Math.cos(a)];
    const hw = r.size.width / 2;
    const hh = r.size.height / 2;
    const at = (s: number, t: number): Point => [r.center.x + ux[0] * s * hw + vy[0] * t * hh, r.center.y + ux[1] * s * hw + vy[1] * t * hh];
    return [at(-1, -1), at(1, -1), at(1, 1), at(-1, 1)];
  });
}

/**
 * The homography taking four source points to four destination points (the direct linear
 * transform from four correspondences; Hartley & Zisserman, Multiple View Geometry, 2nd ed.,
 * §4.1), as a row-major 3×3 array.
 */
export function perspectiveTransform(from: readonly Point[], to: readonly Point[]): number[] {
  const c = vision();
  const src = c.matFromArray(4, 1, c.CV_32FC2, from.flat());
  const dst = c.matFromArray(4, 1, c.CV_32FC2, to.flat());
  let m: Mat | null = null;
  return withMats([src, dst], () => {
    m = c.getPerspectiveTransform(src, dst) as Mat;
    try {
      return Array.from(m.data64F);
    } finally {
      m.delete();
    }
  });
}

export type { MatVector };
