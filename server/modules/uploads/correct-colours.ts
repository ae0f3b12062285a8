import { bradfordMatrix } from "../../analysis/bradford";
import { D65_WHITE, labToXyz, mul3, SRGB8_TO_LINEAR, SRGB_TO_XYZ, srgbEncode, XYZ_TO_SRGB } from "../../analysis/srgb-lab";
import type { DecodedImage } from "../../images";
import type { Lab } from "../../../shared/colour";

/**
 * The photo as members should see it: the measured paper white becomes D65 white by the same
 * Bradford adaptation the analysis uses, applied in linear sRGB (IEC 61966-2-1).
 */
export function correctToPaperWhite(img: DecodedImage, paper: Lab): DecodedImage {
  const adapt = bradfordMatrix(labToXyz(paper.l, paper.a, paper.b), D65_WHITE);
  const m = mul3(XYZ_TO_SRGB, mul3(adapt, SRGB_TO_XYZ));
  const encode = new Uint8Array(4097);
  for (let i = 0; i <= 4096; i++) encode[i] = Math.round(srgbEncode(i / 4096) * 255);
  const out = Buffer.allocUnsafe(img.data.length);
  const d = img.data;
  for (let p = 0; p < d.length; p += 3) {
    const r = SRGB8_TO_LINEAR[d[p]!]!;
    const g = SRGB8_TO_LINEAR[d[p + 1]!]!;
    const b = SRGB8_TO_LINEAR[d[p + 2]!]!;
    for (let c = 0; c < 3; c++) {
      const v = m[c * 3]! * r + m[c * 3 + 1]! * g + m[c * 3 + 2]! * b;
      out[p + c] = encode[v <= 0 ? 0 : v >= 1 ? 4096 : Math.round(v * 4096)]!;
    }
  }
  return { ...img, data: out };
}
