import request from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { decisionReasons } from "../../shared/schemas/moderation";
import { nowIso } from "../../server/db/client";
import { createTestApp, DEMO, ORIGIN, sessionCookieFor, type TestApp } from "../setup/test-app";

// Visitors' gallery answers are cached briefly with a validator (ETag, If-None-Match → 304:
// RFC 9110 §8.8.3 and §13.1.2), but never past a write: "nothing but published strips ever
// reaches a visitor" (BRIEF) holds from the very next request.

let t: TestApp;
let stripId = 0;
beforeAll(async () => {
  t = await createTestApp();
  const author = await t.db.selectFrom("User").select("id").where("email", "=", DEMO.member).executeTakeFirstOrThrow();
  const at = nowIso();
  await t.db.insertInto("uploads").values({ id: "cache-upload", owner_id: author.id, status: "ready", mime: "image/webp", byte_size: 1, created_at: at, updated_at: at }).execute();
  const row = await t.db
    .insertInto("strips")
    .values({ author_id: author.id, upload_id: "cache-upload", title: "Dusk over the mill pond", paper: "smooth-cardstock", notes_html: "", tools_json: "[]", status: "published", orientation: "horizontal", ink_count: 0, created_at: at, updated_at: at, published_at: at })
    .returning("id")
    .executeTakeFirstOrThrow();
  stripId = row.id;
});
afterAll(() => t.close());

const titles = (body: { items: { title: string }[] }) => body.items.map((s) => s.title);

describe("the visitors' gallery cache", () => {
  it("answers with an ETag and a short public max-age; the same ETag back gets 304", async () => {
    const first = await request(t.app).get("/api/strips").expect(200);
    expect(titles(first.body)).toContain("Dusk over the mill pond");
    expect(first.headers.etag).toMatch(/^W\/".+"$/);
    expect(first.headers["cache-control"]).toBe("public, max-age=5");
    expect(first.headers.vary).toMatch(/Cookie/);
    const again = await request(t.app).get("/api/strips").set("If-None-Match", first.headers.etag!).expect(304);
    expect(again.text).toBe("");
    const other = await request(t.app).get("/api/strips?color=%23000000").expect(200); // another answer, another ETag
    expect(other.headers.etag).not.toBe(first.headers.etag);
  });

  it("a strip a moderator hides is gone from the very next visitor's answer", async () => {
    const before = await request(t.app).get("/api/strips").expect(200);
    expect(titles(before.body)).toContain("Dusk over the mill pond");
    const mod = await sessionCookieFor(t, DEMO.moderator);
    await request(t.app)
      .post(`/api/strips/${stripId}/decisions`)
      .set("Cookie", mod)
      .set("Origin", ORIGIN)
      .send({ action: "hide", reason: decisionReasons.hide[0], note: "", expectedVersion: 1 })
      .expect(200);
    const after = await request(t.app).get("/api/strips").set("If-None-Match", before.headers.etag!).expect(200);
    expect(titles(after.body)).not.toContain("Dusk over the mill pond");
  });

  it("signed-in members are never served from it, and their answers are private", async () => {
    const member = await sessionCookieFor(t, DEMO.member);
    const res = await request(t.app).get("/api/strips").set("Cookie", member).expect(200);
    expect(res.headers["cache-control"]).toBe("private, no-cache");
  });

  it("an invalid query is still refused when a valid one is cached", async () => {
    await request(t.app).get("/api/strips?limit=5").expect(200);
    await request(t.app).get("/api/strips?limit=500").expect(400);
  });
});
