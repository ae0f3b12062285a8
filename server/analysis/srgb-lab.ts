// The per-pixel sRGB ↔ CIELAB maths moved to shared/colour/srgb-lab.ts so the blend preview in
// the browser and the analysis here use one implementation of the blend model (see
// shared/colour/blend.ts). Kept as a re-export so the analysis's imports stay short.
export * from "../../shared/colour/srgb-lab";
