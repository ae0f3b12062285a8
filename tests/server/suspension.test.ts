import { randomUUID } from "node:crypto";
import request from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { WRITES_ALLOWED_WHILE_SUSPENDED } from "../../server/middleware/suspension";
import { fillPath, listRoutes, type RouteInfo } from "../setup/routes";
import { createTestApp, DEMO, ORIGIN, sessionCookieFor, type TestApp } from "../setup/test-app";

let t: TestApp;
let noorId = "";
let cookie = "";
let routes: RouteInfo[] = [];
const REASON = "binder names advertising a shop";

beforeAll(async () => {
  t = await createTestApp();
  routes = listRoutes(t.app);
  cookie = await sessionCookieFor(t, DEMO.newMember);
  noorId = (await request(t.app).get("/api/me").set("Cookie", cookie).expect(200)).body.id;
  // Suspended by a moderator through the API, so the reason is in the audit trail as in real life.
  const ivo = await sessionCookieFor(t, DEMO.moderator);
  await request(t.app).put(`/api/members/${noorId}/suspension`).set("Cookie", ivo).set("Origin", ORIGIN).send({ days: 5, reason: REASON }).expect(200);
  cookie = await sessionCookieFor(t, DEMO.newMember); // the suspension ended the old session
});
afterAll(() => t.close());

const writes = () => routes.filter((r) => r.path.startsWith("/api/") && !["GET", "HEAD", "OPTIONS"].includes(r.method));
const key = (r: RouteInfo) => `${r.method} ${r.path.slice("/api".length)}`;

describe("a suspended member's account is read-only", () => {
  it("the router table has the write routes we know of (the walk itself works)", () => {
    const names = writes().map(key);
    for (const known of ["PATCH /me", "POST /binders", "PUT /stash", "POST /uploads", "POST /strips/:id/reports", "POST /strips"]) {
      expect(names).toContain(known);
    }
    for (const allowed of WRITES_ALLOWED_WHILE_SUSPENDED) expect(names).toContain(allowed);
  });

  it("every write route in the router table refuses, naming the end date and the reason", async () => {
    const refused: string[] = [];
    for (const route of writes()) {
      if ((WRITES_ALLOWED_WHILE_SUSPENDED as readonly string[]).includes(key(route))) continue;
      const url = fillPath(route.path, (name) => (name === "id" && route.path.includes("/members/") ? randomUUID() : "1"));
      const res = await request(t.app)[route.method.toLowerCase() as "post"](url).set("Cookie", cookie).set("Origin", ORIGIN).send({});
      expect(res.status, `${route.method} ${url}`).toBe(403);
      expect(res.body.error.code, `${route.method} ${url}`).toBe("suspended");
      expect(res.body.error.message).toContain(REASON);
      expect(res.body.error.message).toMatch(/until \d{4}-\d{2}-\d{2}/);
      refused.push(key(route));
    }
    expect(refused.length).toBeGreaterThan(20);
  });

  it("the bio, binders and stash stay as they were", async () => {
    const before = (await request(t.app).get("/api/me").set("Cookie", cookie).expect(200)).body;
    await request(t.app).patch("/api/me").set("Cookie", cookie).set("Origin", ORIGIN).send({ bio: "Visit my shop!" }).expect(403);
    await request(t.app).post("/api/binders").set("Cookie", cookie).set("Origin", ORIGIN).send({ name: "Shop links", visibility: "public" }).expect(403);
    await request(t.app).post("/api/stash/items").set("Cookie", cookie).set("Origin", ORIGIN).send({ inkId: 1 }).expect(403);
    const after = (await request(t.app).get("/api/me").set("Cookie", cookie).expect(200)).body;
    expect(after.bio).toBe(before.bio);
    expect((await request(t.app).get("/api/binders").set("Cookie", cookie).expect(200)).body.items.some((b: { name: string }) => b.name === "Shop links")).toBe(false);
    expect((await request(t.app).get("/api/stash").set("Cookie", cookie).expect(200)).body.items).toHaveLength(0);
  });

  it("may still read, end their own sessions and mark notices read", async () => {
    await request(t.app).get("/api/strips").set("Cookie", cookie).expect(200);
    await request(t.app).post("/api/notices/read").set("Cookie", cookie).set("Origin", ORIGIN).expect(204);
    await request(t.app).post("/api/me/sign-out-everywhere").set("Cookie", cookie).set("Origin", ORIGIN).expect(200);
  });

  it("once the suspension is lifted, writing works again", async () => {
    const mod = await sessionCookieFor(t, DEMO.moderator);
    await request(t.app).put(`/api/members/${noorId}/suspension`).set("Cookie", mod).set("Origin", ORIGIN).send({ days: 0, reason: "served" }).expect(200);
    const fresh = await sessionCookieFor(t, DEMO.newMember);
    await request(t.app).patch("/api/me").set("Cookie", fresh).set("Origin", ORIGIN).send({ bio: "Back to blending." }).expect(200);
  });
});
