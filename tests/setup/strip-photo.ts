import type { Ink } from "../../shared/schemas/inks";
import { renderScene, sceneToJpeg, type SceneSpec } from "../../server/demo/synthetic-photo";

/** A phone-like JPEG of a strip blended from the given catalogue inks, on white cardstock under a warm cast. */
export async function stripPhoto(inks: Pick<Ink, "id" | "lab">[], opts: Partial<SceneSpec> & { quality?: number } = {}) {
  const k = inks.length;
  const blend = 0.06;
  const bandLen = (1 - blend * (k - 1)) / k;
  const bands = inks.map((ink, i) => ({ start: i * (bandLen + blend), end: i * (bandLen + blend) + bandLen, lab: ink.lab, inkId: ink.id }));
  bands[k - 1]!.end = 1;
  const spec: SceneSpec = {
    width: 1200,
    height: 800,
    orientation: "horizontal",
    tiltDeg: 4,
    lengthShare: 0.75,
    thicknessShare: 0.16,
    bands,
    blend: "soft",
    illuminant: "D50",
    exposure: 0.9,
    vignette: 0.1,
    noise: 1.5,
    seed: 7,
    ...opts,
  };
  return { jpeg: await sceneToJpeg(renderScene(spec), opts.quality ?? 88), bands };
}

/** A plain sheet of white paper with nothing on it. */
export async function blankPaperPhoto() {
  const spec: SceneSpec = {
    width: 800,
    height: 600,
    orientation: "horizontal",
    tiltDeg: 0,
    lengthShare: 0,
    thicknessShare: 0,
    bands: [{ start: 0, end: 1, lab: { l: 100, a: 0, b: 0 } }],
    blend: "hard",
    illuminant: "D65",
    exposure: 0.9,
    vignette: 0.05,
    noise: 1.5,
    seed: 3,
  };
  return sceneToJpeg(renderScene(spec), 90);
}

/**
 * The n-th of a series of different-looking photos of the same inks (layout, tilt and framing
 * change), so that posting several does not trip the duplicate-photo check.
 */
export function variedStripPhoto(n: number, inks: Pick<Ink, "id" | "lab">[]) {
  const order = n % 2 === 0 ? inks : [...inks].reverse();
  return stripPhoto(order, {
    seed: 100 + n,
    tiltDeg: -12 + ((n * 5) % 25),
    lengthShare: 0.6 + (n % 4) * 0.06,
    offset: [((n % 3) - 1) * 0.05, ((n % 2) - 0.5) * 0.08],
    orientation: n % 5 === 4 ? "vertical" : "horizontal",
    width: n % 5 === 4 ? 800 : 1200,
    height: n % 5 === 4 ? 1200 : 800,
  });
}
