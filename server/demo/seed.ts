import { randomUUID } from "node:crypto";
import { demoBrands, demoInks } from "../../scripts/demo/catalogue";
import { DEMO_PASSWORD, demoMembers } from "../../scripts/demo/members";
import { hashPassword } from "../auth/passwords";
import { nowIso, type Db } from "../db/client";
import { referenceColour } from "../modules/inks/inks.service";

export async function databaseIsEmpty(db: Db): Promise<boolean> {
  const users = await db.selectFrom("User").select("id").limit(1).execute();
  const brands = await db.selectFrom("brands").select("id").limit(1).execute();
  return users.length === 0 && brands.length === 0;
}

/** Loads the invented demo scenario: brands, inks and the demo accounts. */
export async function seedDemo(db: Db): Promise<{ brands: number; inks: number; members: number }> {
  // Hash outside the transaction: never await slow work while holding SQLite's one connection.
  const hash = await hashPassword(DEMO_PASSWORD);
  const now = nowIso();
  return db.transaction().execute(async (tx) => {
    const brandIds = new Map<string, number>();
    for (const b of demoBrands) {
      const row = await tx
        .insertInto("brands")
        .values({ slug: b.slug, name: b.name, created_at: now })
        .returning("id")
        .executeTakeFirstOrThrow();
      brandIds.set(b.slug, row.id);
    }
    for (const ink of demoInks) {
      const brandId = brandIds.get(ink.brand);
      if (brandId === undefined) throw new Error(`Demo ink ${ink.name} names unknown brand ${ink.brand}`);
      const colour = referenceColour(ink.hex, undefined);
      await tx
        .insertInto("inks")
        .values({
          brand_id: brandId,
          name: ink.name,
          type: ink.type,
          hex: colour.hex,
          lab_l: colour.lab.l,
          lab_a: colour.lab.a,
          lab_b: colour.lab.b,
          discontinued: ink.discontinued ? 1 : 0,
          created_at: now,
          updated_at: now,
        })
        .execute();
    }
    for (const m of demoMembers) {
      const id = randomUUID();
      await tx.insertInto("User").values({ id, name: m.name, email: m.email, emailVerified: now, image: null }).execute();
      await tx
        .insertInto("profiles")
        .values({
          user_id: id,
          name: m.name,
          bio: m.bio,
          role: m.role,
          standing: m.standing,
          suspended_until: null,
          is_demo: 1,
          created_at: now,
          updated_at: now,
        })
        .execute();
      await tx.insertInto("passwords").values({ user_id: id, hash, updated_at: now }).execute();
    }
    return { brands: demoBrands.length, inks: demoInks.length, members: demoMembers.length };
  });
}

export function demoSignInsText(appUrl: string): string {
  const width = Math.max(...demoMembers.map((m) => m.email.length));
  const lines = demoMembers.slice(0, 4).map((m) => {
    const what = m.role === "member" ? `${m.standing} member` : m.role;
    return `  ${m.email.padEnd(width)}  ${what}`;
  });
  const rule = "!".repeat(78);
  // Loud on purpose: demo mode must never be left on by mistake on a server others can reach.
  return [
    rule,
    "!!  DEMO MODE IS ON: shared demo accounts with a published password can sign in,",
    "!!  and mail is kept on this machine instead of being delivered.",
    "!!  Never expose this server to others. Set NODE_ENV=production to switch it off.",
    rule,
    `Blendwell is running on ${appUrl}`,
    `Demo sign-ins (password: ${DEMO_PASSWORD}):`,
    ...lines,
    `  (and ${demoMembers.length - 4} more demo members; see README)`,
    `Mail sent by the app (sign in as ${demoMembers.find((m) => m.role === "admin")?.email ?? "the admin"} first): ${appUrl}/dev/mail`,
  ].join("\n");
}
