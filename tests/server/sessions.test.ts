import { randomUUID } from "node:crypto";
import request from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { hashPassword } from "../../server/auth/passwords";
import { IDLE_MS } from "../../server/auth/sessions";
import { nowIso } from "../../server/db/client";
import { createTestApp, DEMO, ORIGIN, sessionCookieFor, type TestApp } from "../setup/test-app";

// Session termination as OWASP ASVS 5.0 chapter V7 asks for it (requirement numbers quoted from
// memory): V7.4.1 a terminated session cannot be used again, V7.4.2 suspension ends sessions,
// V7.4.3 other sessions end after a password change, V7.5.2 members can end their sessions,
// V7.3.1 an inactivity timeout.

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(() => t.close());

const PASSWORD = "a-long-enough-secret";

/** A member who is not a demo account (demo accounts may not change their password). */
async function makeMember(name: string) {
  const id = randomUUID();
  const email = `${name}@blendwell.test`;
  const now = nowIso();
  await t.db.insertInto("User").values({ id, email, name, emailVerified: null, image: null }).execute();
  await t.db.insertInto("profiles").values({ user_id: id, name, created_at: now, updated_at: now }).execute();
  await t.db.insertInto("passwords").values({ user_id: id, hash: await hashPassword(PASSWORD), updated_at: now }).execute();
  return { id, email };
}

/** A fresh session cookie for any member (sessionCookieFor knows only the demo password). */
async function cookieFor(email: string, password: string = DEMO.password) {
  if (password === DEMO.password) return sessionCookieFor(t, email);
  const csrf = await request(t.app).get("/auth/csrf").expect(200);
  const jar = [csrf.headers["set-cookie"] ?? []].flat().map((c) => c.split(";")[0]!);
  const res = await request(t.app)
    .post("/auth/callback/credentials")
    .set("Cookie", jar.join("; "))
    .set("X-Auth-Return-Redirect", "1")
    .type("form")
    .send({ csrfToken: csrf.body.csrfToken, email, password, callbackUrl: "/" });
  const cookie = [res.headers["set-cookie"] ?? []].flat().map((c) => c.split(";")[0]!).find((c) => c.startsWith("authjs.session-token="));
  if (!cookie) throw new Error(`no session for ${email}`);
  return cookie;
}

const me = (cookie: string) => request(t.app).get("/api/me").set("Cookie", cookie);
const write = (cookie: string) =>
  request(t.app).post("/api/binders").set("Cookie", cookie).set("Origin", ORIGIN).send({ name: "Teal things", visibility: "private" });

async function signOutWith(cookie: string) {
  const csrf = await request(t.app).get("/auth/csrf").set("Cookie", cookie).expect(200);
  const csrfCookie = [csrf.headers["set-cookie"] ?? []].flat().map((c) => c.split(";")[0]!);
  await request(t.app)
    .post("/auth/signout")
    .set("Cookie", [cookie, ...csrfCookie].join("; "))
    .set("X-Auth-Return-Redirect", "1")
    .type("form")
    .send({ csrfToken: csrf.body.csrfToken })
    .expect(200);
}

describe("ending sessions", () => {
  it("after sign-out the same session cookie no longer answers, while other sessions go on", async () => {
    const kept = await sessionCookieFor(t, DEMO.member);
    const ended = await sessionCookieFor(t, DEMO.member);
    await me(ended).expect(200);
    await signOutWith(ended);
    // The browser forgot the cookie; someone who copied it must not be signed in either.
    expect((await me(ended)).status).toBe(401);
    expect((await write(ended)).status).toBe(401);
    await me(kept).expect(200);
  });

  it("a password change ends the member's other sessions but keeps the one that changed it", async () => {
    const m = await makeMember("quill.other");
    const laptop = await cookieFor(m.email, PASSWORD);
    const phone = await cookieFor(m.email, PASSWORD);
    await write(phone).expect(201);
    await request(t.app)
      .put("/api/me/password")
      .set("Cookie", laptop)
      .set("Origin", ORIGIN)
      .send({ currentPassword: PASSWORD, newPassword: "a-brand-new-secret" })
      .expect(204);
    await me(laptop).expect(200);
    expect((await me(phone)).status).toBe(401);
    expect((await write(phone)).status).toBe(401);
  });

  it("'sign out everywhere' ends every session of the member, this one too, and no one else's", async () => {
    const a = await sessionCookieFor(t, DEMO.newMember);
    const b = await sessionCookieFor(t, DEMO.newMember);
    const someoneElse = await sessionCookieFor(t, DEMO.member);
    const res = await request(t.app).post("/api/me/sign-out-everywhere").set("Cookie", a).set("Origin", ORIGIN).expect(200);
    expect(res.body.ended).toBeGreaterThanOrEqual(2);
    expect((await me(a)).status).toBe(401);
    expect((await me(b)).status).toBe(401);
    await me(someoneElse).expect(200);
  });

  it("a suspension and a role change end the member's sessions at once", async () => {
    const suspended = await makeMember("quill.suspended");
    const promoted = await makeMember("quill.promoted");
    const s1 = await cookieFor(suspended.email, PASSWORD);
    const p1 = await cookieFor(promoted.email, PASSWORD);
    const admin = await sessionCookieFor(t, DEMO.admin);
    await request(t.app).put(`/api/members/${suspended.id}/suspension`).set("Cookie", admin).set("Origin", ORIGIN).send({ days: 3, reason: "spam in binder names" }).expect(200);
    await request(t.app).put(`/api/members/${promoted.id}/role`).set("Cookie", admin).set("Origin", ORIGIN).send({ role: "moderator", reason: "helping out" }).expect(200);
    expect((await me(s1)).status).toBe(401);
    expect((await me(p1)).status).toBe(401);
    // Signing in again works; the new session carries the new role.
    const p2 = await cookieFor(promoted.email, PASSWORD);
    expect((await me(p2).expect(200)).body.role).toBe("moderator");
    await me(admin).expect(200);
  });

  it("an idle session ends after the inactivity timeout; use renews it (sliding)", async () => {
    const cookie = await sessionCookieFor(t, DEMO.member);
    const rows = () => t.db.selectFrom("member_sessions").selectAll().where("ended_at", "is", null).orderBy("created_at", "desc").execute();
    const sid = (await rows())[0]!.id;
    // Used a little while ago: the request moves last_seen_at forward.
    const aWhileAgo = new Date(Date.now() - 10 * 60 * 1000).toISOString();
    await t.db.updateTable("member_sessions").set({ last_seen_at: aWhileAgo }).where("id", "=", sid).execute();
    await me(cookie).expect(200);
    const touched = await t.db.selectFrom("member_sessions").select("last_seen_at").where("id", "=", sid).executeTakeFirstOrThrow();
    expect(Date.parse(touched.last_seen_at)).toBeGreaterThan(Date.parse(aWhileAgo));
    // Left alone for longer than the member timeout: ended.
    const tooLong = new Date(Date.now() - IDLE_MS.member - 60 * 1000).toISOString();
    await t.db.updateTable("member_sessions").set({ last_seen_at: tooLong }).where("id", "=", sid).execute();
    expect((await me(cookie)).status).toBe(401);
    const row = await t.db.selectFrom("member_sessions").selectAll().where("id", "=", sid).executeTakeFirstOrThrow();
    expect(row.ended_reason).toBe("idle");
  });

  it("moderators and admins time out sooner than members", () => {
    expect(IDLE_MS.moderator).toBeLessThan(IDLE_MS.member);
    expect(IDLE_MS.admin).toBeLessThanOrEqual(IDLE_MS.moderator);
  });
});

describe("the demo mail viewer", () => {
  it("answers only signed-in admins", async () => {
    expect((await request(t.app).get("/api/dev/mail")).status).toBe(401);
    for (const who of [DEMO.member, DEMO.moderator]) {
      expect((await request(t.app).get("/api/dev/mail").set("Cookie", await sessionCookieFor(t, who))).status).toBe(403);
    }
    const admin = await request(t.app).get("/api/dev/mail").set("Cookie", await sessionCookieFor(t, DEMO.admin)).expect(200);
    expect(Array.isArray(admin.body.messages)).toBe(true);
  });

  it("a magic link asked for someone else's address cannot be read by a visitor", async () => {
    const visitor = t.client();
    const csrf = await visitor.get("/auth/csrf");
    await visitor
      .post("/auth/signin/nodemailer")
      .set("X-Auth-Return-Redirect", "1")
      .type("form")
      .send({ csrfToken: csrf.body.csrfToken, email: DEMO.member, callbackUrl: "/account" })
      .expect(200);
    const res = await visitor.get("/api/dev/mail");
    expect(res.status).toBe(401);
    expect(JSON.stringify(res.body)).not.toMatch(/callback\/nodemailer/);
  });
});

describe("production", () => {
  it("never serves demo accounts or the mail viewer, even with DEMO_MODE=true", async () => {
    // A demo admin session made while demo mode was on must not survive a restart in production.
    const prod = await createTestApp({ env: { NODE_ENV: "production", DEMO_MODE: "true" } });
    try {
      expect(prod.config.demo).toBe(false);
      const csrf = await request(prod.app).get("/auth/csrf").expect(200);
      const jar = [csrf.headers["set-cookie"] ?? []].flat().map((c) => c.split(";")[0]!);
      const res = await request(prod.app)
        .post("/auth/callback/credentials")
        .set("Cookie", jar.join("; "))
        .set("X-Auth-Return-Redirect", "1")
        .type("form")
        .send({ csrfToken: csrf.body.csrfToken, email: DEMO.admin, password: DEMO.password, callbackUrl: "/" });
      expect(new URL(res.body.url, "http://x").searchParams.get("error")).toBe("CredentialsSignin");
      expect((await request(prod.app).get("/api/dev/mail")).status).toBe(404);
      // Nor by e-mailed link: no link is even sent to a demo account.
      const csrf2 = await request(prod.app).get("/auth/csrf").expect(200);
      const jar2 = [csrf2.headers["set-cookie"] ?? []].flat().map((c) => c.split(";")[0]!);
      const link = await request(prod.app)
        .post("/auth/signin/nodemailer")
        .set("Cookie", jar2.join("; "))
        .set("X-Auth-Return-Redirect", "1")
        .type("form")
        .send({ csrfToken: csrf2.body.csrfToken, email: DEMO.admin, callbackUrl: "/" });
      expect(new URL(link.body.url, "http://x").searchParams.get("error")).toBeTruthy();
      await new Promise((r) => setTimeout(r, 200));
      expect((await prod.mail()).filter((m) => m.to.includes(DEMO.admin))).toEqual([]);
    } finally {
      await prod.close();
    }
  });
});
