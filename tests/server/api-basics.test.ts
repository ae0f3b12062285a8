import { afterAll, beforeAll, describe, expect, it } from "vitest";
import request from "supertest";
import { createTestApp, DEMO, ORIGIN, sessionCookieFor, signedIn, type TestApp } from "../setup/test-app";

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(() => t.close());

describe("the API's basics", () => {
  it("answers health", async () => {
    const res = await t.client().get("/api/health").expect(200);
    expect(res.body).toEqual({ ok: true });
  });

  it("sends a Content-Security-Policy that allows no inline scripts", async () => {
    const res = await t.client().get("/api/health");
    const csp = res.headers["content-security-policy"];
    expect(csp).toMatch(/script-src 'self'(;|$)/);
    expect(csp).not.toMatch(/script-src[^;]*unsafe-inline/);
  });

  it("answers unknown API routes with a JSON 404", async () => {
    const res = await t.client().get("/api/nothing-here").expect(404);
    expect(res.body.error.code).toBe("not_found");
  });

  it("rejects malformed JSON with 400 and a clear message", async () => {
    const agent = await signedIn(t, DEMO.moderator);
    const res = await agent.post("/api/brands").set("Content-Type", "application/json").send('{"name": "Broken').expect(400);
    expect(res.body.error).toEqual({ code: "malformed_json", message: "The request body is not valid JSON." });
  });

  it("rejects unknown fields and wrong types field by field", async () => {
    const agent = await signedIn(t, DEMO.moderator);
    const res = await agent.post("/api/brands").send({ name: 42, colour: "red" }).expect(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(["colour", "name"]);
  });

  it("rejects an oversized body with 413", async () => {
    const agent = await signedIn(t, DEMO.moderator);
    const res = await agent.post("/api/brands").send({ name: "x".repeat(200_000) }).expect(413);
    expect(res.body.error.code).toBe("too_large");
  });

  it("rejects a body that is not JSON with 415", async () => {
    const agent = await signedIn(t, DEMO.moderator);
    const res = await agent.post("/api/brands").type("text/plain").send("name=Spruce").expect(415);
    expect(res.body.error.code).toBe("unsupported_media_type");
  });

  it("refuses state-changing requests from another site", async () => {
    const agent = await signedIn(t, DEMO.moderator);
    const res = await agent.post("/api/brands").set("Origin", "https://elsewhere.example").send({ name: "Sneaky Inks" }).expect(403);
    expect(res.body.error.code).toBe("cross_site");
    const brands = await t.client().get("/api/brands").expect(200);
    expect(brands.body.map((b: { name: string }) => b.name)).not.toContain("Sneaky Inks");
  });

  it("falls back to the Referer when there is no Origin, and refuses when there is neither", async () => {
    const cookie = await sessionCookieFor(t, DEMO.moderator);
    const bare = () => request(t.app).post("/api/brands").set("Cookie", cookie);
    const refused = await bare().send({ name: "No Origin Inks" }).expect(403);
    expect(refused.body.error.code).toBe("cross_site");
    await bare().set("Referer", "https://elsewhere.example/page").send({ name: "Other Referer Inks" }).expect(403);
    await bare().set("Referer", `${ORIGIN}/inks/new`).send({ name: "Referer Inks" }).expect(201);
    const names = (await request(t.app).get("/api/brands")).body.map((b: { name: string }) => b.name);
    expect(names).toContain("Referer Inks");
    expect(names).not.toContain("No Origin Inks");
  });
});
