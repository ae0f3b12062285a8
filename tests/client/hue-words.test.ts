// Colour words against the CIELAB (D65) hue angles of the sRGB primaries and secondaries.
// The Lab coordinates are the widely tabulated values for IEC 61966-2-1 sRGB under D65 (from
// memory, two decimals); the test first checks our conversion lands on them, then that each
// hue angle gets the word people use for that colour. The word boundaries are our own.
import { describe, expect, it } from "vitest";
import { hexToLab, hueName, labToLch } from "../../shared/colour";
import { colourWords } from "../../src/lib/colour-words";

const corners = [
  { hex: "#ff0000", lab: [53.24, 80.09, 67.2], word: "red" },
  { hex: "#ffff00", lab: [97.14, -21.55, 94.48], word: "yellow" },
  { hex: "#00ff00", lab: [87.73, -86.18, 83.18], word: "green" },
  { hex: "#00ffff", lab: [91.11, -48.09, -14.13], word: "teal" },
  { hex: "#0000ff", lab: [32.3, 79.19, -107.86], word: "blue" },
  { hex: "#ff00ff", lab: [60.32, 98.23, -60.82], word: "purple" },
] as const;

describe("hue words at the sRGB primaries and secondaries", () => {
  it("sit at the tabulated CIELAB coordinates", () => {
    for (const c of corners) {
      const lab = hexToLab(c.hex);
      expect([lab.l, lab.a, lab.b].map((v) => Math.round(v * 100) / 100)).toEqual(c.lab.map((v) => expect.closeTo(v, 1)));
    }
  });

  it("name each corner's hue angle, in hue order", () => {
    const angles = corners.map((c) => labToLch({ l: c.lab[0], a: c.lab[1], b: c.lab[2] }).h);
    // Red ≈ 40°, yellow ≈ 103°, green ≈ 136°, cyan ≈ 196°, blue ≈ 306°, magenta ≈ 328°.
    expect(angles.map(Math.round)).toEqual([40, 103, 136, 196, 306, 328]);
    for (const c of corners) expect(`${c.hex} ${hueName(hexToLab(c.hex))}`).toBe(`${c.hex} ${c.word}`);
  });

  it("keeps the hue word when only lightness and strength change (a tint of each corner)", () => {
    // Half-way to white in sRGB keeps the hue family; colourWords adds "light"/"pale" and so on.
    const tints = { "#ff8080": "red", "#ffff80": "yellow", "#80ff80": "green", "#80ffff": "teal", "#8080ff": "blue", "#ff80ff": "purple" } as const;
    for (const [hex, word] of Object.entries(tints)) expect(colourWords(hexToLab(hex))).toMatch(new RegExp(`\\b${word}$`));
  });
});
