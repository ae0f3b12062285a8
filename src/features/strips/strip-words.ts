import type { Strip } from "../../../shared/schemas/strips";

/** "Blended strip: Deep Sounding, Gorse Bloom, Garnet Vein" — the photo's alt text. */
export function stripAlt(inkNames: string[]): string {
  return inkNames.length ? `Blended strip: ${inkNames.join(", ")}` : "Blended strip";
}

export function stripAltFor(strip: Pick<Strip, "inks">): string {
  return stripAlt(strip.inks.map((i) => i.name));
}

/** Which way the bands are read, in words. */
export function directionWords(orientation: "horizontal" | "vertical"): string {
  return orientation === "vertical" ? "top to bottom" : "left to right";
}

/** "850 KB", "3.4 MB", "20 MB" (binary units, as the server counts its 20 MB limit). */
export function formatBytes(bytes: number): string {
  if (bytes < 1024 * 1024) return `${Math.max(1, Math.round(bytes / 1024)).toLocaleString("en-GB")} KB`;
  return `${(bytes / (1024 * 1024)).toFixed(1).replace(/\.0$/, "")} MB`;
}
