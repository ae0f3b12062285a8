import { randomUUID } from "node:crypto";
import request from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Role } from "../../shared/schemas/accounts";
import { memberActions, roleRules, type MemberAction } from "../../server/auth/role-rules";
import { nowIso } from "../../server/db/client";
import { createTestApp, DEMO, ORIGIN, sessionCookieFor, type TestApp } from "../setup/test-app";

// Every cell of (actor role, target role, action), exercised over HTTP. The expected answers are
// written out here from the brief's "People" section (moderators work on members: standing and
// suspension; admins do everything a moderator can plus roles) and issue 12 ("moderators never act
// on admins"), not read from the table under test.
const expected: Record<Role, Record<Role, Record<MemberAction, boolean>>> = {
  member: {
    member: { "set standing": false, suspend: false, "change role": false },
    moderator: { "set standing": false, suspend: false, "change role": false },
    admin: { "set standing": false, suspend: false, "change role": false },
  },
  moderator: {
    member: { "set standing": true, suspend: true, "change role": false },
    moderator: { "set standing": false, suspend: false, "change role": false },
    admin: { "set standing": false, suspend: false, "change role": false },
  },
  admin: {
    member: { "set standing": true, suspend: true, "change role": true },
    moderator: { "set standing": true, suspend: true, "change role": true },
    admin: { "set standing": true, suspend: true, "change role": true },
  },
};

const roles: Role[] = ["member", "moderator", "admin"];
let t: TestApp;
const actors: Record<Role, string> = { member: "", moderator: "", admin: "" };

beforeAll(async () => {
  t = await createTestApp();
  actors.member = await sessionCookieFor(t, DEMO.member);
  actors.moderator = await sessionCookieFor(t, DEMO.moderator);
  actors.admin = await sessionCookieFor(t, DEMO.admin);
});
afterAll(() => t.close());

/** A fresh account of the given role for each cell, so one cell's change cannot sway another. */
async function target(role: Role) {
  const id = randomUUID();
  const now = nowIso();
  await t.db.insertInto("User").values({ id, email: `${id}@blendwell.test`, name: null, emailVerified: null, image: null }).execute();
  await t.db.insertInto("profiles").values({ user_id: id, name: `Target ${role}`, role, created_at: now, updated_at: now }).execute();
  return id;
}

function act(actor: Role, targetId: string, targetRole: Role, action: MemberAction) {
  const base = request(t.app).put(`/api/members/${targetId}/${action === "set standing" ? "standing" : action === "suspend" ? "suspension" : "role"}`);
  const body =
    action === "set standing"
      ? { standing: "trusted", reason: "steady posting" }
      : action === "suspend"
        ? { days: 2, reason: "testing the rules" }
        : { role: targetRole === "member" ? "moderator" : "member", reason: "testing the rules" };
  return base.set("Cookie", actors[actor]).set("Origin", ORIGIN).send(body);
}

describe("role rules: who may act on whom", () => {
  const cells = roles.flatMap((actor) => roles.flatMap((targetRole) => memberActions.map((action) => [actor, targetRole, action] as const)));

  it("the table and the expectations cover the same 27 cells", () => {
    expect(cells).toHaveLength(27);
    for (const [actor, targetRole, action] of cells) expect(roleRules[actor][targetRole].includes(action)).toBe(expected[actor][targetRole][action]);
  });

  it.each(cells)("a %s acting on a %s: %s", async (actor, targetRole, action) => {
    const id = await target(targetRole);
    const before = await t.db.selectFrom("profiles").selectAll().where("user_id", "=", id).executeTakeFirstOrThrow();
    const res = await act(actor, id, targetRole, action);
    const after = await t.db.selectFrom("profiles").selectAll().where("user_id", "=", id).executeTakeFirstOrThrow();
    if (expected[actor][targetRole][action]) {
      expect(res.status).toBe(200);
      expect(after).not.toEqual(before);
    } else {
      expect(res.status).toBe(403);
      expect(after).toEqual(before); // a refusal changes nothing
    }
  });

  it("nobody suspends themselves or changes their own role", async () => {
    const adminId = (await request(t.app).get("/api/me").set("Cookie", actors.admin).expect(200)).body.id;
    expect((await act("admin", adminId, "admin", "suspend")).status).toBe(422);
    expect((await act("admin", adminId, "admin", "change role")).status).toBe(422);
  });
});
