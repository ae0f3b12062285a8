import { hexToLab } from "../../../shared/colour";
import { colourWords } from "../../lib/colour-words";
import { formatHex } from "../../lib/format";

/** "deep blue #23506B": a cover colour in words and numbers, never by the patch alone. */
export function hexInWords(hex: string): string {
  try {
    return `${colourWords(hexToLab(hex))} ${formatHex(hex)}`;
  } catch {
    return formatHex(hex);
  }
}
