import sharp from "sharp";
import type { Ink } from "../../shared/schemas/inks";
import { centreLineOf } from "../../shared/schemas/outlines";
import type { Analysis, Outline, StripReading } from "../../shared/schemas/uploads";
import { analyzePixels, loadVision, type CatalogueInk } from "../../server/analysis";
import type { Db } from "../../server/db/client";
import { renderScene, type Scene, type SceneSpec } from "../../server/demo/synthetic-photo";

/** Each strip's tile: a 1200 × 400 synthetic photo, the strip horizontal and centred in it. */
export const TILE = { width: 1200, height: 400, lengthShare: 0.75, thicknessShare: 0.16 } as const;

/**
 * A photo of several strips one above another on one white card: synthetic one-strip scenes
 * (server/demo/synthetic-photo.ts) stacked top to bottom. Truth from the generator's geometry:
 * each strip is 0.75 × 1200 = 900 px long and 0.16 × 900 = 144 px thick, centred in its tile, so
 * its corners are x 150 and 1050, y tile centre ± 72 (here as fractions of the whole photo).
 */
export async function severalStripsPhoto(inkSets: Pick<Ink, "id" | "lab">[][], seed = 31) {
  const tiles: Scene[] = inkSets.map((inks, k) => {
    const blend = 0.06;
    const bandLen = (1 - blend * (inks.length - 1)) / inks.length;
    const spec: SceneSpec = {
      width: TILE.width,
      height: TILE.height,
      orientation: "horizontal",
      tiltDeg: 0,
      lengthShare: TILE.lengthShare,
      thicknessShare: TILE.thicknessShare,
      bands: inks.map((ink, i) => ({ start: i * (bandLen + blend), end: i === inks.length - 1 ? 1 : i * (bandLen + blend) + bandLen, lab: ink.lab, inkId: ink.id })),
      blend: "soft",
      illuminant: "D65",
      exposure: 0.9,
      vignette: 0,
      noise: 1.2,
      seed: seed + k,
    };
    return renderScene(spec);
  });
  const height = TILE.height * tiles.length;
  const data = Buffer.concat(tiles.map((t) => t.data));
  const jpeg = await sharp(data, { raw: { width: TILE.width, height, channels: 3 } }).jpeg({ quality: 90 }).toBuffer();
  const length = TILE.lengthShare * TILE.width;
  const half = (TILE.thicknessShare * length) / 2;
  const x0 = (TILE.width - length) / 2 / TILE.width;
  const x1 = 1 - x0;
  const outlines: Outline[] = tiles.map((_, k) => {
    const cy = TILE.height * k + TILE.height / 2;
    const top = (cy - half) / height;
    const bottom = (cy + half) / height;
    return [
      [x0, top],
      [x1, top],
      [x1, bottom],
      [x0, bottom],
    ];
  });
  return { jpeg, tiles, outlines, width: TILE.width, height };
}

/** Each tile read by the real analysis on its own, placed at its true outline in the photo. */
export async function readingsOf(tiles: Scene[], outlines: Outline[], catalogue: CatalogueInk[]): Promise<StripReading[]> {
  // The analysis finds strips with OpenCV (WebAssembly), loaded once per thread.
  await loadVision();
  return tiles.map((tile, index) => {
    const a = analyzePixels({ width: tile.width, height: tile.height, data: tile.data }, { catalogue });
    return { index, outline: outlines[index]!, orientation: a.orientation, bands: a.bands, transitions: a.transitions, notices: [] };
  });
}

/**
 * Gives an upload these strips, as the analysis writes a several-strip result (strips[], with
 * the one-strip fields describing strips[0]). Stands in for the analysis's own detection of
 * several strips, so the API is tested on its own.
 */
export async function giveStrips(db: Db, uploadId: string, strips: StripReading[]) {
  const row = await db.selectFrom("uploads").select(["analysis_json", "width", "height"]).where("id", "=", uploadId).executeTakeFirstOrThrow();
  const analysis = JSON.parse(row.analysis_json!) as Analysis;
  const first = strips[0]!;
  const next: Analysis = {
    ...analysis,
    orientation: first.orientation,
    bands: first.bands,
    transitions: first.transitions,
    strip: centreLineOf(first.outline, row.width!, row.height!),
    strips,
    notices: analysis.notices ?? [],
  };
  await db.updateTable("uploads").set({ analysis_json: JSON.stringify(next) }).where("id", "=", uploadId).execute();
}
