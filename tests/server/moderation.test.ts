import request from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createMailer } from "../../server/mail/mailer";
import { createOutbox, enqueueMail } from "../../server/mail/outbox";
import pino from "pino";
import type { Ink } from "../../shared/schemas/inks";
import type { ModerationLogEntry, ReviewQueueItem } from "../../shared/schemas/moderation";
import { createTestApp, DEMO, signedIn, type TestApp } from "../setup/test-app";
import { variedStripPhoto } from "../setup/strip-photo";

type Agent = ReturnType<TestApp["client"]>;
let t: TestApp;
let inks: Ink[];
let noor: Agent;
let mara: Agent;
let ivo: Agent;
let admin: Agent;
let photos = 0;

beforeAll(async () => {
  t = await createTestApp();
  inks = (await request(t.app).get("/api/inks?pageSize=100")).body.items;
  [noor, mara, ivo, admin] = await Promise.all([DEMO.newMember, DEMO.member, DEMO.moderator, DEMO.admin].map((e) => signedIn(t, e)));
});
afterAll(() => t.close());

const ink = (name: string) => inks.find((i) => i.name === name)!;
const idOf = async (agent: Agent) => (await agent.get("/api/me")).body.id as string;

async function postStrip(agent: Agent, title = `Strip ${photos}`) {
  const chosen = [ink("Deep Sounding"), ink("Gorse Bloom"), ink("Garnet Vein")];
  const { jpeg } = await variedStripPhoto(photos++, chosen);
  const upload = (await agent.post("/api/uploads").attach("image", jpeg, "strip.jpg").expect(202)).body.id;
  await t.services.uploads.idle();
  const res = await agent
    .post("/api/strips")
    .send({ uploadId: upload, title, paper: "smooth-cardstock", inks: chosen.map((i) => i.id) })
    .expect(201);
  return (await agent.get(`/api/strips/${res.body.id}`).expect(200)).body as { id: number; version: number; status: string };
}

const decide = (agent: Agent, id: number, body: Record<string, unknown>) => agent.post(`/api/strips/${id}/decisions`).send(body);

async function mailTo(email: string, subject: RegExp) {
  await t.outbox.flush();
  for (let i = 0; i < 40; i++) {
    const found = (await t.mail()).find((m) => m.to.includes(email) && subject.test(m.subject));
    if (found) return found;
    await new Promise((r) => setTimeout(r, 50));
  }
  throw new Error(`no mail to ${email} matching ${subject}`);
}

describe("the review queue", () => {
  it("is for moderators only", async () => {
    await request(t.app).get("/api/review-queue").expect(401);
    await mara.get("/api/review-queue").expect(403);
    await ivo.get("/api/review-queue").expect(200);
    await admin.get("/api/review-queue").expect(200);
  });

  it("shows a new member's strip with why it is there, the author's standing and suggestions", async () => {
    const strip = await postStrip(noor, "Night harbour to gorse");
    const { items } = (await ivo.get("/api/review-queue").expect(200)).body as { items: ReviewQueueItem[] };
    const item = items.find((i) => i.strip.id === strip.id)!;
    expect(item.reasons).toEqual(["new member"]);
    expect(item.author).toMatchObject({ name: "Noor Vessant", standing: "new" });
    expect(item.suggestions).toHaveLength(3);
    expect(item.farBands).toEqual([]);
  });

  it("counts what waits for the header's badge, the same strips the queue lists", async () => {
    await request(t.app).get("/api/review-queue/count").expect(401);
    await mara.get("/api/review-queue/count").expect(403);
    const before = (await ivo.get("/api/review-queue/count").expect(200)).body.count as number;
    const { items } = (await ivo.get("/api/review-queue").expect(200)).body as { items: ReviewQueueItem[] };
    expect(before).toBe(items.length);
    const pending = items.find((i) => i.strip.status === "pending")!;
    await decide(ivo, pending.strip.id, { action: "reject", reason: "not a blended strip", expectedVersion: pending.strip.version }).expect(200);
    expect((await admin.get("/api/review-queue/count").expect(200)).body.count).toBe(before - 1);
  });
});

describe("deciding", () => {
  it("approving publishes the strip, records it with before and after, and tells the author in the app and by mail", async () => {
    const strip = await postStrip(noor, "Approve me");
    const res = await decide(ivo, strip.id, { action: "approve", reason: "looks good", expectedVersion: strip.version }).expect(200);
    expect(res.body.status).toBe("published");
    await request(t.app).get(`/api/strips/${strip.id}`).expect(200);

    const log = (await ivo.get(`/api/moderation/log?strip=${strip.id}`).expect(200)).body.items;
    expect(log[0]).toMatchObject({ action: "approve", reason: "looks good", before: "pending", after: "published", moderator: { name: "Ivo Kellerhof" } });

    const notices = (await noor.get("/api/notices").expect(200)).body.items;
    expect(notices.some((n: { title: string }) => n.title === '"Approve me" is published')).toBe(true);
    const mail = await mailTo(DEMO.newMember, /"Approve me" is published/);
    expect(mail.text).toContain(`/strips/${strip.id}`);
  });

  it("returning for edits gives the author the reason; their edit sends it back to the queue", async () => {
    const strip = await postStrip(noor, "Return me");
    await decide(ivo, strip.id, { action: "return", reason: "inks need naming or correcting", note: "the middle ink looks lighter", expectedVersion: strip.version }).expect(200);
    const seen = (await noor.get(`/api/strips/${strip.id}`).expect(200)).body;
    expect(seen.status).toBe("returned");
    expect(seen.statusReason).toBe("inks need naming or correcting: the middle ink looks lighter");
    const mail = await mailTo(DEMO.newMember, /"Return me" needs a few edits/);
    expect(mail.text).toContain("the middle ink looks lighter");

    await noor.patch(`/api/strips/${strip.id}`).send({ title: "Return me, fixed" }).expect(200);
    const { items } = (await ivo.get("/api/review-queue")).body as { items: ReviewQueueItem[] };
    expect(items.find((i) => i.strip.id === strip.id)?.reasons).toEqual(["edited, back to review"]);
  });

  it("hiding takes a published strip out of view for everyone; restoring brings it back", async () => {
    const strip = await postStrip(mara, "Hide and restore");
    expect(strip.status).toBe("published");
    await decide(ivo, strip.id, { action: "hide", reason: "someone else's photo", expectedVersion: strip.version }).expect(200);
    await request(t.app).get(`/api/strips/${strip.id}`).expect(404);
    await request(t.app).get(`/api/strips/${strip.id}/images/thumb`).expect(404);
    expect((await request(t.app).get("/api/strips?limit=50")).body.items.map((s: { id: number }) => s.id)).not.toContain(strip.id);
    await decide(ivo, strip.id, { action: "restore", reason: "hidden by mistake", expectedVersion: strip.version + 1 }).expect(200);
    await request(t.app).get(`/api/strips/${strip.id}`).expect(200);
  });

  it("when two moderators decide at once, the second learns it was already decided and nothing changes", async () => {
    const strip = await postStrip(noor, "Two moderators");
    await decide(ivo, strip.id, { action: "approve", reason: "looks good", expectedVersion: strip.version }).expect(200);
    const late = await decide(admin, strip.id, { action: "reject", reason: "spam or advertising", expectedVersion: strip.version }).expect(409);
    expect(late.body.error.code).toBe("already_decided");
    expect((await request(t.app).get(`/api/strips/${strip.id}`).expect(200)).body.status).toBe("published");
    const log = (await ivo.get(`/api/moderation/log?strip=${strip.id}`)).body.items;
    expect(log).toHaveLength(1);
  });

  it("refuses unknown actions, missing or unlisted reasons, 'other' without a note, and actions that do not fit the state", async () => {
    const strip = await postStrip(noor, "Bad decisions");
    await decide(ivo, strip.id, { action: "delete", reason: "looks good", expectedVersion: strip.version }).expect(400);
    await decide(ivo, strip.id, { action: "approve", expectedVersion: strip.version }).expect(400);
    await decide(ivo, strip.id, { action: "approve", reason: "because", expectedVersion: strip.version }).expect(400);
    await decide(ivo, strip.id, { action: "hide", reason: "other", expectedVersion: strip.version }).expect(400);
    await decide(ivo, strip.id, { action: "restore", reason: "hidden by mistake", expectedVersion: strip.version }).expect(409);
    await decide(mara, strip.id, { action: "approve", reason: "looks good", expectedVersion: strip.version }).expect(403);
    await decide(ivo, 999999, { action: "approve", reason: "looks good", expectedVersion: 1 }).expect(404);
    expect((await noor.get(`/api/strips/${strip.id}`)).body.status).toBe("pending");
  });

  it("bulk approval decides each strip on its own", async () => {
    const a = await postStrip(noor, "Bulk A");
    const b = await postStrip(noor, "Bulk B");
    const res = await ivo
      .post("/api/review-queue/decisions")
      .send({ action: "approve", reason: "looks good", items: [{ id: a.id, expectedVersion: a.version }, { id: b.id, expectedVersion: b.version + 5 }] })
      .expect(200);
    expect(res.body.results).toEqual([
      { id: a.id, ok: true, status: "published" },
      { id: b.id, ok: false, error: expect.stringMatching(/changed since you opened it/) },
    ]);
  });

  it("a moderator corrects the ink tags and the author is told", async () => {
    const strip = await postStrip(mara, "Wrong inks");
    const res = await ivo.put(`/api/strips/${strip.id}/inks`).send({ inks: [ink("Garnet Vein").id, ink("Deep Sounding").id], note: "order was reversed", expectedVersion: strip.version }).expect(200);
    expect(res.body.version).toBe(strip.version + 1);
    const after = (await request(t.app).get(`/api/strips/${strip.id}`)).body;
    expect(after.inks.map((i: { name: string }) => i.name)).toEqual(["Garnet Vein", "Deep Sounding"]);
    const mail = await mailTo(DEMO.member, /Ink tags corrected on "Wrong inks"/);
    expect(mail.text).toContain("Garnet Vein, Deep Sounding");
    // The log names the ink order before and after.
    const log = (await ivo.get("/api/moderation/log").query({ strip: String(strip.id) }).expect(200)).body.items as ModerationLogEntry[];
    const entry = log.find((e) => e.action === "correct inks")!;
    expect([entry.before, entry.after]).toEqual(["Deep Sounding, Gorse Bloom, Garnet Vein", "Garnet Vein, Deep Sounding"]);
    await mara.put(`/api/strips/${strip.id}/inks`).send({ inks: [ink("Garnet Vein").id], expectedVersion: 2 }).expect(403);
  });
});

describe("reports", () => {
  it("a member reports a published strip once; not their own, not an unpublished one", async () => {
    const strip = await postStrip(mara, "Reported once");
    const res = await noor.post(`/api/strips/${strip.id}/reports`).send({ reason: "wrong inks" }).expect(201);
    expect(res.body).toEqual({ received: true, held: false });
    expect((await noor.post(`/api/strips/${strip.id}/reports`).send({ reason: "offensive" }).expect(409)).body.error.code).toBe("already_reported");
    await mara.post(`/api/strips/${strip.id}/reports`).send({ reason: "wrong inks" }).expect(422);
    await request(t.app).post(`/api/strips/${strip.id}/reports`).set("Origin", "http://localhost:3000").send({ reason: "wrong inks" }).expect(401);
    await noor.post(`/api/strips/${strip.id}/reports`).send({ reason: "other" }).expect(400);
    // (Noor is trusted by now: three of her strips were approved above.)
    const pending = await postStrip(await signedIn(t, "ruth@blendwell.test"), "Not yet public");
    expect(pending.status).toBe("pending");
    await mara.post(`/api/strips/${pending.id}/reports`).send({ reason: "wrong inks" }).expect(404);
    const { items } = (await ivo.get("/api/review-queue")).body as { items: ReviewQueueItem[] };
    expect(items.find((i) => i.strip.id === strip.id)?.reasons).toEqual(["reported"]);
  });

  it("three reports from different members hold a strip; the moderator's decision tells each reporter", async () => {
    const strip = await postStrip(mara, "Held by reports");
    const others = await Promise.all(["priya@blendwell.test", "elke@blendwell.test", "femi@blendwell.test"].map((e) => signedIn(t, e)));
    const answers = [];
    for (const who of others) answers.push((await who.post(`/api/strips/${strip.id}/reports`).send({ reason: "someone else's photo" }).expect(201)).body);
    expect(answers.map((a) => a.held)).toEqual([false, false, true]);
    await request(t.app).get(`/api/strips/${strip.id}`).expect(404);
    const { items } = (await ivo.get("/api/review-queue")).body as { items: ReviewQueueItem[] };
    const held = items.find((i) => i.strip.id === strip.id)!;
    expect(held.reasons).toEqual(["held: reports"]);
    expect(held.reports).toHaveLength(3);
    const current = (await ivo.get(`/api/strips/${strip.id}`)).body;
    await decide(ivo, strip.id, { action: "approve", reason: "reports checked: nothing wrong", expectedVersion: current.version }).expect(200);
    await request(t.app).get(`/api/strips/${strip.id}`).expect(200);
    for (const who of others) {
      const notices = (await who.get("/api/notices")).body.items.map((n: { title: string }) => n.title);
      expect(notices).toEqual(expect.arrayContaining(["Report received", "Your report was handled"]));
    }
  });
});

describe("standing, suspension and roles", () => {
  it("three approved strips make a new member trusted", async () => {
    const jonah = await signedIn(t, "jonah@blendwell.test");
    for (let i = 0; i < 3; i++) {
      const s = await postStrip(jonah, `Jonah's strip ${i}`);
      expect(s.status).toBe("pending");
      await decide(ivo, s.id, { action: "approve", reason: "looks good", expectedVersion: s.version }).expect(200);
    }
    expect((await jonah.get("/api/me")).body.standing).toBe("trusted");
    const next = await postStrip(jonah, "Jonah, trusted");
    expect(next.status).toBe("published");
  });

  it("a moderator suspends a member, who then cannot post or report; a moderator cannot suspend an admin", async () => {
    const ruth = await signedIn(t, "ruth@blendwell.test");
    const ruthId = await idOf(ruth);
    await ivo.put(`/api/members/${ruthId}/suspension`).send({ days: 7, reason: "repeated spam" }).expect(200);
    const target = await postStrip(mara, "Ruth cannot report this");
    // The suspension ended her session (issue 12); signed in again, the account is read-only.
    await ruth.post(`/api/strips/${target.id}/reports`).send({ reason: "wrong inks" }).expect(401);
    const ruthAgain = await signedIn(t, "ruth@blendwell.test");
    expect((await ruthAgain.post(`/api/strips/${target.id}/reports`).send({ reason: "wrong inks" }).expect(403)).body.error.code).toBe("suspended");
    const adminId = await idOf(admin);
    await ivo.put(`/api/members/${adminId}/suspension`).send({ days: 7, reason: "testing limits" }).expect(403);
    expect((await admin.get("/api/me")).body.suspendedUntil).toBeNull();
    await ivo.put(`/api/members/${ruthId}/suspension`).send({ days: 0, reason: "served" }).expect(200);
    await mara.put(`/api/members/${ruthId}/suspension`).send({ days: 1, reason: "not a moderator" }).expect(403);
  });

  it("only admins change roles, and every change is in the trail", async () => {
    const priyaId = await idOf(await signedIn(t, "priya@blendwell.test"));
    await ivo.put(`/api/members/${priyaId}/role`).send({ role: "moderator", reason: "helping out" }).expect(403);
    await admin.put(`/api/members/${priyaId}/role`).send({ role: "moderator", reason: "helping out" }).expect(200);
    const log = (await ivo.get(`/api/moderation/log?member=${priyaId}&action=change%20role`)).body.items;
    expect(log[0]).toMatchObject({ before: "member", after: "moderator", reason: "helping out" });
    await admin.put(`/api/members/${priyaId}/role`).send({ role: "member", reason: "back to posting" }).expect(200);
  });
});

describe("the audit trail and mail", () => {
  it("cannot be edited or deleted, even directly in the database", async () => {
    await expect(t.db.updateTable("moderation_actions").set({ reason: "rewritten" }).execute()).rejects.toThrow(/append-only/);
    await expect(t.db.deleteFrom("moderation_actions").execute()).rejects.toThrow(/append-only/);
  });

  it("is for moderators only", async () => {
    await mara.get("/api/moderation/log").expect(403);
    await request(t.app).get("/api/moderation/log").expect(401);
  });

  it("mail that cannot be sent waits for a retry and does not lose the message", async () => {
    // An SMTP port where nothing listens: the send fails, the row stays queued with its error.
    const deadMailer = createMailer({ host: "127.0.0.1", port: 9 }, "test@blendwell.test");
    const outbox = createOutbox({ db: t.db, mailer: deadMailer, logger: pino({ level: "silent" }) });
    await t.outbox.flush();
    await enqueueMail(t.db, { to: "someone@blendwell.test", subject: "Retry me", text: "hello" });
    expect(await outbox.flush()).toBe(0);
    const row = await t.db.selectFrom("mail_outbox").selectAll().where("subject", "=", "Retry me").executeTakeFirstOrThrow();
    expect(row.sent_at).toBeNull();
    expect(row.attempts).toBe(1);
    expect(row.last_error).toBeTruthy();
    expect(row.next_attempt_at > new Date().toISOString()).toBe(true);
    deadMailer.close();
  });
});
