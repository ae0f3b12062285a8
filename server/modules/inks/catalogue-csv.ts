import { parse } from "csv-parse/sync";
import { z } from "zod";
import { hexSchema, labSchema, plainText } from "../../../shared/schemas/common";
import { catalogueCsvColumns, inkTypeSchema } from "../../../shared/schemas/inks";
import { AppError, fieldsFromZod } from "../../middleware/errors";

export const MAX_CATALOGUE_ROWS = 5000;

const yesNo = z
  .string()
  .transform((s) => s.trim().toLowerCase())
  .pipe(z.enum(["", "yes", "no", "true", "false", "1", "0", "y", "n"], { error: "must be yes or no" }))
  .transform((s) => ["yes", "true", "1", "y"].includes(s));

const optionalNumber = z
  .string()
  .trim()
  .transform((s, ctx) => {
    if (s === "") return undefined;
    const n = Number(s);
    if (!Number.isFinite(n)) {
      ctx.addIssue({ code: "custom", message: "must be a number" });
      return z.NEVER;
    }
    return n;
  });

const rowSchema = z
  .object({
    brand: plainText(2, 60),
    name: plainText(1, 80),
    type: z.string().trim().toLowerCase().pipe(inkTypeSchema),
    hex: z
      .string()
      .trim()
      .transform((s) => (s === "" ? undefined : s))
      .pipe(hexSchema.optional()),
    l: optionalNumber,
    a: optionalNumber,
    b: optionalNumber,
    discontinued: yesNo,
  })
  .transform((r, ctx) => {
    const given = [r.l, r.a, r.b].filter((v) => v !== undefined).length;
    if (given !== 0 && given !== 3) {
      ctx.addIssue({ code: "custom", message: "l, a and b go together: give all three or none", path: ["l"] });
      return z.NEVER;
    }
    const lab = given === 3 ? labSchema.safeParse({ l: r.l, a: r.a, b: r.b }) : undefined;
    if (lab && !lab.success) {
      ctx.addIssue({ code: "custom", message: "L* must be 0–100 and a*, b* within ±128", path: ["l"] });
      return z.NEVER;
    }
    if (!r.hex && !lab) {
      ctx.addIssue({ code: "custom", message: "give the colour as hex or as l, a, b", path: ["hex"] });
      return z.NEVER;
    }
    return { brand: r.brand, name: r.name, type: r.type, hex: r.hex, lab: lab?.data, discontinued: r.discontinued };
  });

export type CatalogueRow = z.output<typeof rowSchema> & { line: number };

function invalid(fields: Record<string, string[]>, message = "The catalogue was not imported: fix the lines listed."): never {
  throw new AppError("csv_invalid", message, 422, fields);
}

function looksLikeText(buf: Buffer): boolean {
  if (buf.includes(0)) return false;
  return !new TextDecoder("utf-8", { fatal: false }).decode(buf).includes("\uFFFD");
}

/** Parses and checks every row; any bad row rejects the whole file with each line's problems. */
export function parseCatalogueCsv(buf: Buffer): CatalogueRow[] {
  if (buf.length === 0) invalid({ file: ["is empty"] }, "The file is empty.");
  if (!looksLikeText(buf)) invalid({ file: ["is not a CSV text file"] }, "That file is not a CSV text file.");

  let records: { record: Record<string, string>; info: { lines: number } }[];
  try {
    records = parse(buf, {
      bom: true,
      columns: (header: string[]) => {
        const cols = header.map((h) => h.trim().toLowerCase());
        const unknown = cols.filter((c) => !(catalogueCsvColumns as readonly string[]).includes(c));
        const missing = ["brand", "name", "type"].filter((c) => !cols.includes(c));
        if (unknown.length || missing.length || new Set(cols).size !== cols.length) {
          const problems = [
            ...unknown.map((c) => `unknown column "${c}"`),
            ...missing.map((c) => `missing column "${c}"`),
            ...(new Set(cols).size !== cols.length ? ["a column is repeated"] : []),
          ];
          invalid({ "line 1": problems }, `The header row must name the columns: ${catalogueCsvColumns.join(",")}.`);
        }
        return cols;
      },
      skip_empty_lines: true,
      info: true,
      trim: false,
    });
  } catch (err) {
    if (err instanceof AppError) throw err;
    const e = err as { lines?: number; message?: string };
    const line = e.lines ?? 0;
    invalid({ [`line ${line}`]: [String(e.message ?? "cannot be read as CSV").replace(/^Invalid Record Length: /, "")] },
      "The file could not be read as CSV.");
  }

  if (records.length === 0) invalid({ file: ["has a header but no inks"] }, "The file lists no inks.");
  if (records.length > MAX_CATALOGUE_ROWS) {
    invalid({ file: [`has ${records.length} rows; the limit is ${MAX_CATALOGUE_ROWS}`] }, "The file is too long.");
  }

  const fields: Record<string, string[]> = {};
  const rows: CatalogueRow[] = [];
  const seen = new Map<string, number>();
  for (const { record, info } of records) {
    const line = info.lines;
    const withDefaults = Object.fromEntries(catalogueCsvColumns.map((c) => [c, record[c] ?? ""]));
    const parsed = rowSchema.safeParse(withDefaults);
    if (!parsed.success) {
      fields[`line ${line}`] = Object.entries(fieldsFromZod(parsed.error)).flatMap(([k, msgs]) =>
        msgs.map((m) => `${k}: ${m}`),
      );
      continue;
    }
    const key = `${parsed.data.brand.toLowerCase()}\u0000${parsed.data.name.toLowerCase()}`;
    const first = seen.get(key);
    if (first !== undefined) {
      fields[`line ${line}`] = [`repeats the ink on line ${first}`];
      continue;
    }
    seen.set(key, line);
    rows.push({ ...parsed.data, line });
  }
  if (Object.keys(fields).length) invalid(fields);
  return rows;
}
