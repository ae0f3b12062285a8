import type { CatalogueRow } from "./catalogue-csv";
import type { Brand, Ink, InkList, InkListQuery, inkInput, inkPatch } from "../../../shared/schemas/inks";
import { deltaE2000, hexToLab, labToHex, type Lab } from "../../../shared/colour";
import type { z } from "zod";
import { nowIso, type Db, type DbOrTx } from "../../db/client";
import { AppError, notFound } from "../../middleware/errors";
import * as repo from "./inks.repository";

const round = (n: number, places = 2) => Math.round(n * 10 ** places) / 10 ** places;

export function toInk(row: repo.InkJoinedRow): Ink {
  return {
    id: row.id,
    name: row.name,
    brand: { id: row.brand_id, slug: row.brand_slug, name: row.brand_name },
    type: row.type,
    hex: row.hex,
    lab: { l: row.lab_l, a: row.lab_a, b: row.lab_b },
    discontinued: row.discontinued === 1,
    createdAt: row.created_at,
    updatedAt: row.updated_at,
  };
}

/**
 * A reference colour from hex, L*a*b* or both. L*a*b* is the measurement when given;
 * a hex given beside it must describe the same colour.
 */
export function referenceColour(hex: string | undefined, lab: Lab | undefined): { hex: string; lab: Lab } {
  if (lab) {
    const derived = labToHex(lab);
    if (hex && deltaE2000(hexToLab(hex), lab) > 2) {
      throw new AppError("colour_mismatch", "The hex and L*a*b* values describe different colours.", 422, {
        hex: [`does not match L*a*b* (that colour is about ${derived})`],
      });
    }
    return { hex: hex ?? derived, lab: { l: round(lab.l), a: round(lab.a), b: round(lab.b) } };
  }
  if (!hex) throw new AppError("invalid_request", "Give the reference colour.", 400, { hex: ["is required"] });
  const l = hexToLab(hex);
  return { hex, lab: { l: round(l.l), a: round(l.a), b: round(l.b) } };
}

export async function listInks(db: Db, q: InkListQuery): Promise<InkList> {
  const { rows, total } = await repo.listInks(db, q);
  return { items: rows.map(toInk), page: q.page, pageSize: q.pageSize, total };
}

export async function getInk(db: DbOrTx, id: number): Promise<Ink> {
  const row = await repo.findInk(db, id);
  if (!row) throw notFound("That ink");
  return toInk(row);
}

async function assertBrand(db: DbOrTx, brandId: number) {
  if (!(await repo.findBrand(db, brandId))) {
    throw new AppError("unknown_brand", "That brand is not in the catalogue.", 422, { brandId: ["is not a known brand"] });
  }
}

async function assertUniqueName(db: DbOrTx, brandId: number, name: string, exceptId?: number) {
  const clash = await repo.findInkByBrandAndName(db, brandId, name);
  if (clash && clash.id !== exceptId) {
    throw new AppError("duplicate_ink", "This brand already has an ink with that name.", 409, {
      name: ["is already used by this brand"],
    });
  }
}

export async function createInk(db: Db, input: z.output<typeof inkInput>): Promise<Ink> {
  const colour = referenceColour(input.hex, input.lab);
  return db.transaction().execute(async (tx) => {
    await assertBrand(tx, input.brandId);
    await assertUniqueName(tx, input.brandId, input.name);
    const now = nowIso();
    const id = await repo.insertInk(tx, {
      brand_id: input.brandId,
      name: input.name,
      type: input.type,
      hex: colour.hex,
      lab_l: colour.lab.l,
      lab_a: colour.lab.a,
      lab_b: colour.lab.b,
      discontinued: input.discontinued ? 1 : 0,
      created_at: now,
      updated_at: now,
    });
    return getInk(tx, id);
  });
}

export async function editInk(db: Db, id: number, patch: z.output<typeof inkPatch>): Promise<Ink> {
  return db.transaction().execute(async (tx) => {
    const current = await getInk(tx, id);
    const brandId = patch.brandId ?? current.brand.id;
    const name = patch.name ?? current.name;
    if (patch.brandId !== undefined) await assertBrand(tx, brandId);
    if (patch.name !== undefined || patch.brandId !== undefined) await assertUniqueName(tx, brandId, name, id);
    const colour =
      patch.hex !== undefined || patch.lab !== undefined ? referenceColour(patch.hex, patch.lab) : undefined;
    await repo.updateInk(tx, id, {
      brand_id: brandId,
      name,
      type: patch.type ?? current.type,
      ...(colour && { hex: colour.hex, lab_l: colour.lab.l, lab_a: colour.lab.a, lab_b: colour.lab.b }),
      ...(patch.discontinued !== undefined && { discontinued: patch.discontinued ? 1 : 0 }),
      updated_at: nowIso(),
    });
    return getInk(tx, id);
  });
}

export function slugify(name: string): string {
  const slug = name
    .normalize("NFKD")
    .replace(/[\u0300-\u036f]/g, "")
    .toLowerCase()
    .replace(/&/g, " and ")
    .replace(/[^a-z0-9]+/g, "-")
    .replace(/^-+|-+$/g, "")
    .slice(0, 60)
    .replace(/-+$/, "");
  return slug || "brand";
}

export async function listBrands(db: Db): Promise<Brand[]> {
  const rows = await repo.listBrands(db);
  return rows.map((r) => ({ id: r.id, slug: r.slug, name: r.name, inkCount: Number(r.ink_count) }));
}

/** Adds a brand; the slug gets a number when another brand already has it. */
export async function createBrandIn(tx: DbOrTx, name: string): Promise<number> {
  if (await repo.findBrandByName(tx, name)) {
    throw new AppError("duplicate_brand", "A brand with that name already exists.", 409, {
      name: ["is already in the catalogue"],
    });
  }
  const base = slugify(name);
  let slug = base;
  for (let n = 2; await repo.findBrandBySlug(tx, slug); n++) slug = `${base}-${n}`;
  return repo.insertBrand(tx, { slug, name, created_at: nowIso() });
}

export async function createBrand(db: Db, name: string): Promise<Brand> {
  const id = await db.transaction().execute((tx) => createBrandIn(tx, name));
  const brand = (await listBrands(db)).find((b) => b.id === id);
  if (!brand) throw notFound("That brand");
  return brand;
}

/** Imports checked catalogue rows in one transaction: new brands and inks are added, known inks updated. */
export async function importCatalogue(db: Db, rows: CatalogueRow[]) {
  const colours = new Map<number, { hex: string; lab: Lab }>();
  const fields: Record<string, string[]> = {};
  for (const row of rows) {
    try {
      colours.set(row.line, referenceColour(row.hex, row.lab));
    } catch (err) {
      if (!(err instanceof AppError)) throw err;
      fields[`line ${row.line}`] = Object.values(err.fields ?? {}).flat();
    }
  }
  if (Object.keys(fields).length) {
    throw new AppError("csv_invalid", "The catalogue was not imported: fix the lines listed.", 422, fields);
  }
  return db.transaction().execute(async (tx) => {
    const result = { created: 0, updated: 0, brandsCreated: 0 };
    const brandIds = new Map<string, number>();
    for (const row of rows) {
      const key = row.brand.toLowerCase();
      let brandId = brandIds.get(key);
      if (brandId === undefined) {
        const existing = await repo.findBrandByName(tx, row.brand);
        brandId = existing?.id ?? (await createBrandIn(tx, row.brand));
        if (!existing) result.brandsCreated++;
        brandIds.set(key, brandId);
      }
      const colour = colours.get(row.line)!;
      const values = {
        type: row.type,
        hex: colour.hex,
        lab_l: colour.lab.l,
        lab_a: colour.lab.a,
        lab_b: colour.lab.b,
        discontinued: (row.discontinued ? 1 : 0) as 0 | 1,
        updated_at: nowIso(),
      };
      const existing = await repo.findInkByBrandAndName(tx, brandId, row.name);
      if (existing) {
        await repo.updateInk(tx, existing.id, values);
        result.updated++;
      } else {
        await repo.insertInk(tx, { ...values, brand_id: brandId, name: row.name, created_at: values.updated_at });
        result.created++;
      }
    }
    return result;
  });
}
