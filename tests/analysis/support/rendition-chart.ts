// The 24-patch colour rendition chart of McCamy, Marcus & Davidson (1976), "A color-rendition
// chart", J. Applied Photographic Engineering 2(3), 95–99. The patch names are the paper's; the
// 8-bit sRGB values are the widely reproduced sRGB renderings of its published colours
// (transcribed from memory, so they are approximate — which does not matter here: the test only
// needs known colours that span the chart's range).
export const RENDITION_CHART: { name: string; srgb: [number, number, number] }[] = [
  { name: "dark skin", srgb: [115, 82, 68] },
  { name: "light skin", srgb: [194, 150, 130] },
  { name: "blue sky", srgb: [98, 122, 157] },
  { name: "foliage", srgb: [87, 108, 67] },
  { name: "blue flower", srgb: [133, 128, 177] },
  { name: "bluish green", srgb: [103, 189, 170] },
  { name: "orange", srgb: [214, 126, 44] },
  { name: "purplish blue", srgb: [80, 91, 166] },
  { name: "moderate red", srgb: [193, 90, 99] },
  { name: "purple", srgb: [94, 60, 108] },
  { name: "yellow green", srgb: [157, 188, 64] },
  { name: "orange yellow", srgb: [224, 163, 46] },
  { name: "blue", srgb: [56, 61, 150] },
  { name: "green", srgb: [70, 148, 73] },
  { name: "red", srgb: [175, 54, 60] },
  { name: "yellow", srgb: [231, 199, 31] },
  { name: "magenta", srgb: [187, 86, 149] },
  { name: "cyan", srgb: [8, 133, 161] },
  { name: "white", srgb: [243, 243, 242] },
  { name: "neutral 8", srgb: [200, 200, 200] },
  { name: "neutral 6.5", srgb: [160, 160, 160] },
  { name: "neutral 5", srgb: [122, 122, 121] },
  { name: "neutral 3.5", srgb: [85, 85, 85] },
  { name: "black", srgb: [52, 52, 52] },
];
