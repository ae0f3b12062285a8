import { hueName, labToLch, type Lab } from "../../shared/colour";

const neutral = new Set(["black", "white", "grey"]);
const alreadyMuted = new Set(["brown", "beige", "olive"]);

/**
 * A colour in plain words: hueName's word plus one lightness/strength modifier, in the style of
 * the ISCC–NBS colour names (Kelly & Judd, 1976, "Color: Universal Language and Dictionary of
 * Names", NBS Special Publication 440): pale, light, dark, deep, greyish, vivid. The boundaries
 * are our own, not the ISCC–NBS centroids.
 */
export function colourWords(lab: Lab): string {
  const name = hueName(lab);
  if (neutral.has(name)) {
    if (name !== "grey") return name;
    if (lab.l >= 70) return "light grey";
    if (lab.l < 40) return "dark grey";
    return "grey";
  }
  const { c } = labToLch(lab);
  const greyish = c < 22 && !alreadyMuted.has(name);
  if (greyish && lab.l >= 70) return `pale ${name}`;
  if (greyish && lab.l < 40) return `dark greyish ${name}`;
  if (greyish) return `greyish ${name}`;
  if (lab.l >= 75) return `light ${name}`;
  if (lab.l < 38) return c >= 45 ? `deep ${name}` : `dark ${name}`;
  if (c >= 65) return `vivid ${name}`;
  return name;
}
