import { writeFile } from "node:fs/promises";
import path from "node:path";
import { randomUUID } from "node:crypto";
import type { Logger } from "pino";
import { demoStripIdeas } from "../../scripts/demo/strip-ideas";
import { castMatrix, renderScene, sceneToJpeg, seededRandom, survivesCast, type SceneSpec } from "./synthetic-photo";
import type { Db } from "../db/client";
import { loadMe } from "../modules/accounts/accounts.service";
import type { Services } from "../services";

const CASTS = ["D65", "D50", "D75", "F2", "D50"] as const;

/**
 * Posts the demo strips the way a member would: a generated photo of each strip idea goes
 * through the real upload analysis, then becomes a strip (published for trusted authors,
 * waiting in the review queue for new ones). A few members save strips and keep stashes.
 */
export async function seedDemoStrips(deps: { db: Db; services: Services; logger: Logger }) {
  const { db, services, logger } = deps;
  const rand = seededRandom(2026);
  const inks = await db
    .selectFrom("inks")
    .innerJoin("brands", "brands.id", "inks.brand_id")
    .select(["inks.id", "inks.name", "brands.slug", "inks.lab_l", "inks.lab_a", "inks.lab_b"])
    .execute();
  const users = await db.selectFrom("User").select(["id", "email"]).execute();
  const uploads: { ideaIndex: number; uploadId: string; authorId: string }[] = [];

  for (const [i, idea] of demoStripIdeas.entries()) {
    const author = users.find((u) => u.email === idea.authorEmail);
    const chosen = idea.inks.map((ref) => inks.find((k) => k.slug === ref.brand && k.name === ref.name));
    if (!author || chosen.some((c) => !c)) throw new Error(`Demo strip "${idea.title}" names an unknown author or ink`);
    const labs = chosen.map((c) => ({ l: c!.lab_l, a: c!.lab_a, b: c!.lab_b }));
    const cast = CASTS.find((c, k) => k >= i % CASTS.length && labs.every((lab) => survivesCast(lab, castMatrix(c)))) ?? "D65";
    const vertical = i % 6 === 5;
    const k = labs.length;
    const blend = 0.05 + rand() * 0.04;
    const len = (1 - blend * (k - 1)) / k;
    const spec: SceneSpec = {
      width: vertical ? 800 : 1200,
      height: vertical ? 1200 : 800,
      orientation: vertical ? "vertical" : "horizontal",
      tiltDeg: (rand() * 2 - 1) * 8,
      lengthShare: 0.66 + rand() * 0.12,
      thicknessShare: 0.13 + rand() * 0.06,
      offset: [(rand() - 0.5) * 0.05, (rand() - 0.5) * 0.05],
      bands: labs.map((lab, b) => ({ start: b * (len + blend), end: b === k - 1 ? 1 : b * (len + blend) + len, lab })),
      blend: "soft",
      illuminant: cast,
      exposure: 0.86 + rand() * 0.08,
      vignette: rand() * 0.2,
      noise: 1 + rand(),
      seed: 5000 + i,
      specks: Math.floor(rand() * 3),
    };
    const file = path.join(services.store.tmpDir, `seed-${randomUUID()}.jpg`);
    const jpeg = await sceneToJpeg(renderScene(spec), 86 + Math.floor(rand() * 8));
    await writeFile(file, jpeg);
    const { id } = await services.uploads.accept(author.id, { path: file, size: jpeg.length, mime: "image/jpeg" });
    uploads.push({ ideaIndex: i, uploadId: id, authorId: author.id });
  }
  await services.uploads.idle();

  let posted = 0;
  const now = Date.now();
  for (const u of uploads) {
    const idea = demoStripIdeas[u.ideaIndex]!;
    const me = await loadMe(db, u.authorId);
    const upload = await db.selectFrom("uploads").select(["status", "error_message"]).where("id", "=", u.uploadId).executeTakeFirstOrThrow();
    if (!me || upload.status !== "ready") {
      logger.warn({ title: idea.title, error: upload.error_message }, "demo strip photo was not analysed; skipped");
      continue;
    }
    const inkIds = idea.inks.map((ref) => inks.find((k) => k.slug === ref.brand && k.name === ref.name)!.id);
    const { id } = await services.strips.create(me, {
      uploadId: u.uploadId,
      stripIndex: 0,
      title: idea.title,
      notes: idea.notes,
      paper: idea.paper,
      tools: idea.tools,
      videoUrl: undefined,
      inks: inkIds,
    });
    // Spread the demo over the past two months so "newest" reads naturally.
    const when = new Date(now - (uploads.length - u.ideaIndex) * 31 * 60 * 60 * 1000).toISOString();
    await db
      .updateTable("strips")
      .set((eb) => ({ created_at: when, updated_at: when, published_at: eb.case().when("status", "=", "published").then(when).else(null).end() }))
      .where("id", "=", id)
      .execute();
    posted++;
  }
  await seedSavesAndStashes(db, services, rand);
  return { strips: posted };
}

async function seedSavesAndStashes(db: Db, services: Services, rand: () => number) {
  const published = await db.selectFrom("strips").select(["id", "author_id"]).where("status", "=", "published").orderBy("id").execute();
  const members = await db.selectFrom("profiles").innerJoin("User", "User.id", "profiles.user_id").select(["profiles.user_id", "User.email"]).execute();
  const inkIds = (await db.selectFrom("inks").select("id").orderBy("id").execute()).map((r) => r.id);
  for (const [m, member] of members.entries()) {
    const me = await loadMe(db, member.user_id);
    if (!me) continue;
    const binder = await services.binders.create(me, {
      name: ["Favourite blends", "Sunset experiments", "To try next", "Cool tones", "Autumn cards"][m % 5]!,
      description: "Strips I keep coming back to.",
      visibility: m % 3 === 2 ? "private" : "public",
    });
    const picks = published.filter((s) => s.author_id !== me.id && rand() < 0.35).slice(0, 8);
    for (const s of picks) await services.binders.addItem(binder.id, me, { stripId: s.id, note: "" });
    // A member owns the inks of the strips they blended, and a scattering of others.
    const ownStrips = published.filter((s) => s.author_id === me.id).map((s) => s.id);
    const used: Set<number> = ownStrips.length
      ? new Set((await db.selectFrom("strip_inks").select("ink_id").where("strip_id", "in", ownStrips).execute()).map((r) => r.ink_id))
      : new Set<number>();
    // …and they are one ink short of a couple of strips they admired (all but one of its inks).
    const admired = published.filter((s) => s.author_id !== me.id && rand() < 0.1).slice(0, 2);
    for (const s of admired) {
      const order = await db.selectFrom("strip_inks").select("ink_id").where("strip_id", "=", s.id).orderBy("position").execute();
      for (const r of order.slice(0, -1)) used.add(r.ink_id);
    }
    const stash = inkIds.filter((id) => used.has(id) || rand() < 0.12).map((inkId) => ({ inkId, runningLow: rand() < 0.15 }));
    await services.stash.replace(me, { items: stash });
  }
}
