// Printable sheets (PDF, through pdfkit): a practice card for a plan and a stash chart. Both are
// readable in black and white — every swatch has a border and its ink's name and hex printed
// beside it, never colour alone. The Karla font ships with the app (@fontsource/karla in
// node_modules), so nothing is fetched from elsewhere.
import { createRequire } from "node:module";
import PDFDocument from "pdfkit";
import { hueName, labToLch, type Lab } from "../../../shared/colour";
import { previewLayout } from "../../../shared/colour/blend-preview";
import { joinFacts } from "../../../shared/colour/joins";

const require = createRequire(import.meta.url);
const FONT = require.resolve("@fontsource/karla/files/karla-latin-400-normal.woff");
const FONT_BOLD = require.resolve("@fontsource/karla/files/karla-latin-700-normal.woff");

export const paperSizes = ["a4", "letter"] as const;
export type PaperSize = (typeof paperSizes)[number];

export type SheetInk = { id: number; name: string; brand: string; hex: string; lab: Lab };

const MM = 72 / 25.4;
const INK = "#1c2130";
const MUTED = "#3f4555";
/** A practice strip as cut from cardstock: about 150 × 25 mm (a common size — our own choice). */
const STRIP_W = 150 * MM;
const STRIP_H = 25 * MM;
// Karla's Latin files have no Greek delta, so printed sheets write ΔE2000 as dE2000.
const DE = "dE2000";

function newDoc(size: PaperSize, title: string) {
  const doc = new PDFDocument({ size: size === "a4" ? "A4" : "LETTER", margin: 13 * MM, info: { Title: title, Author: "Blendwell" } });
  doc.registerFont("Karla", FONT);
  doc.registerFont("Karla-Bold", FONT_BOLD);
  doc.font("Karla").fillColor(INK);
  return doc;
}

function finish(doc: PDFKit.PDFDocument): Promise<Buffer> {
  const chunks: Buffer[] = [];
  doc.on("data", (c: Buffer) => chunks.push(c));
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on("end", () => resolve(Buffer.concat(chunks)));
    doc.on("error", reject);
  });
  doc.end();
  return done;
}

const upperHex = (hex: string) => hex.toUpperCase();
const colourWord = (lab: Lab) => hueName(lab);

/** Starts a new page when fewer than `need` points are left. */
function ensureRoom(doc: PDFKit.PDFDocument, need: number) {
  if (doc.y + need > doc.page.height - doc.page.margins.bottom) doc.addPage();
}

function heading(doc: PDFKit.PDFDocument, text: string) {
  ensureRoom(doc, 40);
  doc.moveDown(0.4).font("Karla-Bold").fontSize(12).fillColor(INK).text(text, doc.page.margins.left);
  doc.font("Karla").fontSize(9);
}

/** The planned strip at real width: thin rectangles along the predicted blend, with a border. */
function drawStrip(doc: PDFKit.PDFDocument, labs: Lab[], x: number, y: number) {
  const layout = previewLayout(labs, 40);
  const stops = layout.stops;
  for (let i = 0; i < stops.length - 1; i++) {
    const a = stops[i]!;
    const b = stops[i + 1]!;
    if (b.at <= a.at) continue;
    // Each slice takes the colour of its left stop; slices overlap by a hair so no white seams print.
    doc.rect(x + a.at * STRIP_W, y, (b.at - a.at) * STRIP_W + 0.3, STRIP_H).fill(a.hex);
  }
  doc.lineWidth(0.8).rect(x, y, STRIP_W, STRIP_H).stroke(INK);
  // Band numbers under the strip, so the order reads without colour.
  doc.fontSize(9).fillColor(INK);
  layout.bands.forEach((band, i) => {
    const cx = x + ((band.from + band.to) / 2) * STRIP_W;
    doc.text(String(i + 1), cx - 10, y + STRIP_H + 2, { width: 20, align: "center", lineBreak: false });
  });
}

/** A practice card for a plan: the preview at real width, boxes to swatch each ink, the ink order and join hints. */
export function practiceCardPdf(inks: SheetInk[], size: PaperSize): Promise<Buffer> {
  const doc = newDoc(size, `Practice card: ${inks.map((i) => i.name).join(", ")}`);
  const left = doc.page.margins.left;
  doc.font("Karla-Bold").fontSize(18).text("Blendwell practice card");
  // Karla's Latin files have no arrows: the order is written out.
  doc.font("Karla").fontSize(10).fillColor(MUTED).text(inks.map((i, n) => `${n + 1}. ${i.name}`).join("   "));
  doc.fillColor(INK).moveDown(0.5);
  doc.fontSize(9).text(`Blend preview at real size (${Math.round(STRIP_W / MM)} × ${Math.round(STRIP_H / MM)} mm): flat bands and the predicted joins.`);
  const stripY = doc.y + 4;
  drawStrip(doc, inks.map((i) => i.lab), left, stripY);
  doc.y = stripY + STRIP_H + 16;

  // One empty box under each band, as wide as the band, to swatch that ink by hand.
  doc.font("Karla-Bold").fontSize(10).text("Swatch each ink in its box", left);
  const boxY = doc.y + 3;
  const boxH = 14 * MM;
  const layout = previewLayout(inks.map((i) => i.lab), 2);
  layout.bands.forEach((band, i) => {
    const x = left + band.from * STRIP_W;
    const w = (band.to - band.from) * STRIP_W;
    doc.lineWidth(0.8).rect(x, boxY, w, boxH).stroke(INK);
    doc.font("Karla").fontSize(7).fillColor(INK).text(`${i + 1}. ${inks[i]!.name}`, x + 2, boxY + boxH + 2, { width: w - 2, height: 18, ellipsis: true });
  });
  doc.y = boxY + boxH + 22;
  doc.font("Karla-Bold").fontSize(10).text("Blend your strip here", left);
  const tryY = doc.y + 3;
  doc.lineWidth(0.8).dash(4, { space: 3 }).rect(left, tryY, STRIP_W, STRIP_H).stroke(INK).undash();
  doc.y = tryY + STRIP_H + 6;

  heading(doc, "Ink order");
  inks.forEach((ink, i) => {
    doc.font("Karla-Bold").text(`${i + 1}. ${ink.name}`, left, doc.y, { continued: true }).font("Karla").text(`  ${ink.brand} · ${upperHex(ink.hex)} · ${colourWord(ink.lab)}`);
  });

  heading(doc, "The joins");
  doc.fontSize(8.5);
  for (let i = 1; i < inks.length; i++) {
    const a = inks[i - 1]!;
    const b = inks[i]!;
    const f = joinFacts(a.lab, b.lab);
    ensureRoom(doc, 40);
    doc.font("Karla-Bold").text(`Join ${i}–${i + 1}: ${a.name} into ${b.name}. `, left, doc.y, { continued: true });
    doc.font("Karla").text(`Step: ${f.words} (${DE} ${f.deltaE.toFixed(1)}). Middle of the join: ${upperHex(f.middle.hex)} (${colourWord(f.middle.lab)}).`);
    if (f.muddy) {
      doc.font("Karla-Bold").text("MUDDY JOIN: ", { continued: true }).font("Karla").text(`the middle keeps only ${Math.round(f.chromaRatio * 100)} % of the colour strength of the weaker ink. Put a bridge ink between them.`);
    }
    if (f.takeover) {
      const dark = f.takeover === "first" ? a : b;
      const light = f.takeover === "first" ? b : a;
      doc.font("Karla-Bold").text("TAKEOVER: ", { continued: true }).font("Karla").text(`${dark.name} (L* ${dark.lab.l.toFixed(0)}) is far darker than ${light.name} (L* ${light.lab.l.toFixed(0)}). Blend it in lightly, from the ${light.name} side.`);
    }
    if (!f.muddy && !f.takeover) doc.fillColor(MUTED).text("No muddy join or takeover expected.").fillColor(INK);
    doc.moveDown(0.3);
  }
  ensureRoom(doc, 30);
  doc.moveDown(0.3).fontSize(7.5).fillColor(MUTED).text(
    `${DE}: the CIEDE2000 colour difference (up to 2 barely different, up to 5 similar, up to 10 noticeably different, above very different). Joins are predicted with the blend model the strip analysis uses (dye over dye, Beer–Lambert); printers and paper change colours, so trust the inks you swatch here.`,
    left,
  );
  return finish(doc);
}

/** Hue groups in the order a colour wheel reads, neutrals last. */
const HUE_ORDER = ["red", "orange", "yellow", "olive", "green", "teal", "blue", "purple", "pink", "brown", "beige", "grey", "white", "black"];

/** Every ink a member owns as a labelled box with its catalogue swatch and an empty box beside it, grouped by hue. */
export function stashChartPdf(owner: string, inks: SheetInk[], size: PaperSize): Promise<Buffer> {
  const doc = newDoc(size, `Stash chart: ${owner}`);
  const left = doc.page.margins.left;
  doc.font("Karla-Bold").fontSize(20).text("Blendwell stash chart");
  doc.font("Karla").fontSize(11).fillColor(MUTED).text(`${owner} · ${inks.length} ${inks.length === 1 ? "ink" : "inks"}, grouped by hue · swatch each ink in the empty box beside its catalogue colour`);
  doc.fillColor(INK);
  const groups = new Map<string, SheetInk[]>();
  for (const ink of inks) {
    const word = hueName(ink.lab);
    groups.set(word, [...(groups.get(word) ?? []), ink]);
  }
  const colW = (doc.page.width - 2 * left - 8 * MM) / 2;
  const sw = 16 * MM;
  const rowH = 16 * MM;
  for (const word of HUE_ORDER) {
    const list = groups.get(word);
    if (!list) continue;
    list.sort((a, b) => labToLch(b.lab).l - labToLch(a.lab).l || a.name.localeCompare(b.name));
    heading(doc, `${word[0]!.toUpperCase()}${word.slice(1)} (${list.length})`);
    for (let i = 0; i < list.length; i += 2) {
      ensureRoom(doc, rowH + 4);
      const y = doc.y + 2;
      list.slice(i, i + 2).forEach((ink, j) => {
        const x = left + j * (colW + 8 * MM);
        doc.rect(x, y, sw, rowH - 3 * MM).fill(ink.hex);
        doc.lineWidth(0.8).rect(x, y, sw, rowH - 3 * MM).stroke(INK);
        doc.lineWidth(0.6).dash(3, { space: 2 }).rect(x + sw + 2 * MM, y, sw, rowH - 3 * MM).stroke(INK).undash();
        const tx = x + 2 * sw + 5 * MM;
        const tw = colW - 2 * sw - 5 * MM;
        doc.font("Karla-Bold").fontSize(9).fillColor(INK).text(ink.name, tx, y, { width: tw, lineBreak: false, ellipsis: true });
        doc.font("Karla").fontSize(8).text(ink.brand, tx, y + 11, { width: tw, lineBreak: false, ellipsis: true });
        doc.text(`${upperHex(ink.hex)} · ${word}`, tx, y + 21, { width: tw, lineBreak: false });
      });
      doc.x = left;
      doc.y = y + rowH;
    }
  }
  if (!inks.length) doc.moveDown().fontSize(11).text("Your stash is empty: add the inks you own on Blendwell first.");
  return finish(doc);
}
