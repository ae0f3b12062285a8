import request from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createTestApp, DEMO, signIn, signedIn, type TestApp } from "../setup/test-app";

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(() => t.close());

const errorOf = (url: string) => new URL(url, "http://x").searchParams.get("error");

async function latestLinkTo(email: string): Promise<string> {
  for (let i = 0; i < 50; i++) {
    const mail = (await t.mail()).find((m) => m.to.includes(email));
    if (mail) {
      const link = mail.text.match(/https?:\/\/\S+/)?.[0];
      if (!link) throw new Error("no link in the sign-in mail");
      return link;
    }
    await new Promise((r) => setTimeout(r, 50));
  }
  throw new Error(`no mail reached ${email}`);
}

describe("signing in with a password", () => {
  it.each([
    [DEMO.member, "member", "trusted"],
    [DEMO.newMember, "member", "new"],
    [DEMO.moderator, "moderator", "trusted"],
    [DEMO.admin, "admin", "trusted"],
  ])("%s signs in and is told their role", async (email, role, standing) => {
    const agent = await signedIn(t, email);
    const me = await agent.get("/api/me").expect(200);
    expect(me.body).toMatchObject({ email, role, standing, hasPassword: true });
  });

  it("a visitor gets 401 from /api/me", async () => {
    const res = await request(t.app).get("/api/me").expect(401);
    expect(res.body.error.code).toBe("unauthenticated");
  });

  it("a wrong password does not sign in", async () => {
    const agent = t.client();
    const res = await signIn(agent, DEMO.member, "not-the-password");
    expect(errorOf(res.body.url)).toBe("CredentialsSignin");
    await agent.get("/api/me").expect(401);
  });

  it("an unknown e-mail address gets the same answer as a wrong password", async () => {
    const agent = t.client();
    const res = await signIn(agent, "nobody@blendwell.test", DEMO.password);
    expect(errorOf(res.body.url)).toBe("CredentialsSignin");
    await agent.get("/api/me").expect(401);
  });

  it("signing out ends the session", async () => {
    const agent = await signedIn(t, DEMO.member);
    const csrf = await agent.get("/auth/csrf");
    await agent
      .post("/auth/signout")
      .set("X-Auth-Return-Redirect", "1")
      .type("form")
      .send({ csrfToken: csrf.body.csrfToken })
      .expect(200);
    await agent.get("/api/me").expect(401);
  });
});

describe("demo accounts outside demo mode", () => {
  it("cannot sign in with the demo password", async () => {
    const prod = await createTestApp({ env: { DEMO_MODE: "false" } });
    try {
      const agent = prod.client();
      const res = await signIn(agent, DEMO.admin);
      expect(errorOf(res.body.url)).toBe("CredentialsSignin");
      await agent.get("/api/me").expect(401);
      // and the developers' mail viewer is off
      await prod.client().get("/api/dev/mail").expect(404);
    } finally {
      await prod.close();
    }
  });
});

describe("signing in with an e-mailed link", () => {
  async function askForLink(agent: ReturnType<TestApp["client"]>, email: string) {
    const csrf = await agent.get("/auth/csrf");
    return agent
      .post("/auth/signin/nodemailer")
      .set("X-Auth-Return-Redirect", "1")
      .type("form")
      .send({ csrfToken: csrf.body.csrfToken, email, callbackUrl: "/account" });
  }

  it("a new address gets a link through the SMTP server; the link signs in once and makes a member", async () => {
    const email = "quill.newcomer@blendwell.test";
    const res = await askForLink(t.client(), email);
    expect(res.status).toBe(200);
    const verify = await t.client().get(new URL(res.body.url).pathname).expect(302);
    expect(verify.headers.location).toMatch(/\/sign-in\/check-email/);

    const link = new URL(await latestLinkTo(email));
    // The mail opens our confirmation page, not the one-time callback itself.
    expect(link.pathname).toBe("/sign-in/confirm");
    const next = link.searchParams.get("next")!;
    expect(next).toMatch(/^\/auth\/callback\/nodemailer\?/);

    const agent = t.client();
    const callback = await agent.get(next).expect(302);
    expect(callback.headers.location).toMatch(/\/account$/);
    const me = await agent.get("/api/me").expect(200);
    expect(me.body).toMatchObject({ email, role: "member", standing: "new", hasPassword: false });

    const again = await t.client().get(next).expect(302);
    expect(errorOf(again.headers.location)).toBe("Verification");
  });

  it("an expired link does not sign in", async () => {
    const email = "late.reader@blendwell.test";
    expect((await askForLink(t.client(), email)).status).toBe(200);
    const next = new URL(await latestLinkTo(email)).searchParams.get("next")!;
    await t.db
      .updateTable("VerificationToken")
      .set({ expires: new Date(Date.now() - 1000).toISOString() })
      .where("identifier", "=", email)
      .execute();
    const agent = t.client();
    const res = await agent.get(next).expect(302);
    expect(errorOf(res.headers.location)).toBe("Verification");
    await agent.get("/api/me").expect(401);
  });

  it("refuses something that is not one e-mail address", async () => {
    const res = await askForLink(t.client(), "a@blendwell.test, b@blendwell.test");
    expect(errorOf(res.body.url)).toBeTruthy();
    expect((await t.mail()).some((m) => m.to.includes("b@blendwell.test"))).toBe(false);
  });
});

describe("rate limits on sign-in", () => {
  it("stops asking for links to one address after the limit, with a JSON 429", async () => {
    const limited = await createTestApp({ limits: { mailPerAddress: 2 } });
    try {
      const email = "eager@blendwell.test";
      for (let i = 0; i < 2; i++) {
        const agent = limited.client();
        const csrf = await agent.get("/auth/csrf");
        await agent.post("/auth/signin/nodemailer").set("X-Auth-Return-Redirect", "1").type("form")
          .send({ csrfToken: csrf.body.csrfToken, email }).expect(200);
      }
      const agent = limited.client();
      const csrf = await agent.get("/auth/csrf");
      const res = await agent.post("/auth/signin/nodemailer").set("X-Auth-Return-Redirect", "1").type("form")
        .send({ csrfToken: csrf.body.csrfToken, email });
      expect(res.status).toBe(429);
      expect(res.body.error.code).toBe("rate_limited");
    } finally {
      await limited.close();
    }
  });

  it("stops password attempts from one address after the limit", async () => {
    const limited = await createTestApp({ limits: { signInPerIp: 3 } });
    try {
      for (let i = 0; i < 3; i++) await signIn(limited.client(), DEMO.member, "wrong-guess");
      const res = await signIn(limited.client(), DEMO.member);
      expect(res.status).toBe(429);
      expect(res.body.error.message).toMatch(/Too many sign-in attempts/);
    } finally {
      await limited.close();
    }
  });
});

describe("the account", () => {
  it("a member edits their name and sets a password; wrong current password changes nothing", async () => {
    const email = "pen.friend@blendwell.test";
    const agent = t.client();
    const csrf = await agent.get("/auth/csrf");
    await agent.post("/auth/signin/nodemailer").set("X-Auth-Return-Redirect", "1").type("form")
      .send({ csrfToken: csrf.body.csrfToken, email }).expect(200);
    const next = new URL(await latestLinkTo(email)).searchParams.get("next")!;
    await agent.get(next).expect(302);

    const patched = await agent.patch("/api/me").send({ name: "Pen Friend", bio: "Loves teal." }).expect(200);
    expect(patched.body).toMatchObject({ name: "Pen Friend", bio: "Loves teal." });

    await agent.put("/api/me/password").send({ newPassword: "short" }).expect(400);
    await agent.put("/api/me/password").send({ newPassword: "a-long-enough-secret" }).expect(204);
    const wrong = await agent.put("/api/me/password").send({ currentPassword: "nope", newPassword: "another-long-secret" }).expect(422);
    expect(wrong.body.error.fields.currentPassword).toBeDefined();

    const fresh = t.client();
    const ok = await signIn(fresh, email, "a-long-enough-secret");
    expect(errorOf(ok.body.url)).toBeNull();
    expect((await fresh.get("/api/me").expect(200)).body.name).toBe("Pen Friend");
  });

  it("demo accounts keep the shared demo password", async () => {
    const agent = await signedIn(t, DEMO.member);
    const res = await agent.put("/api/me/password").send({ currentPassword: DEMO.password, newPassword: "my-own-secret-1" }).expect(403);
    expect(res.body.error.code).toBe("demo_account");
  });
});
