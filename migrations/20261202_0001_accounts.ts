import { sql, type Kysely } from "kysely";

// Auth.js Kysely adapter tables: names and columns are fixed by the adapter (case-sensitive).
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable("User")
    .addColumn("id", "text", (c) => c.primaryKey())
    .addColumn("name", "text")
    .addColumn("email", "text", (c) => c.unique().notNull())
    .addColumn("emailVerified", "text")
    .addColumn("image", "text")
    .execute();

  await db.schema
    .createTable("Account")
    .addColumn("userId", "text", (c) => c.notNull().references("User.id").onDelete("cascade"))
    .addColumn("type", "text", (c) => c.notNull())
    .addColumn("provider", "text", (c) => c.notNull())
    .addColumn("providerAccountId", "text", (c) => c.notNull())
    .addColumn("refresh_token", "text")
    .addColumn("access_token", "text")
    .addColumn("expires_at", "integer")
    .addColumn("token_type", "text")
    .addColumn("scope", "text")
    .addColumn("id_token", "text")
    .addColumn("session_state", "text")
    .addPrimaryKeyConstraint("Account_pk", ["provider", "providerAccountId"])
    .execute();
  await db.schema.createIndex("Account_userId_idx").on("Account").column("userId").execute();

  await db.schema
    .createTable("Session")
    .addColumn("sessionToken", "text", (c) => c.primaryKey())
    .addColumn("userId", "text", (c) => c.notNull().references("User.id").onDelete("cascade"))
    .addColumn("expires", "text", (c) => c.notNull())
    .execute();

  await db.schema
    .createTable("VerificationToken")
    .addColumn("identifier", "text", (c) => c.notNull())
    .addColumn("token", "text", (c) => c.notNull())
    .addColumn("expires", "text", (c) => c.notNull())
    .addPrimaryKeyConstraint("VerificationToken_pk", ["identifier", "token"])
    .execute();

  // Our own tables. Passwords are kept apart from the adapter's User row.
  await db.schema
    .createTable("passwords")
    .addColumn("user_id", "text", (c) => c.primaryKey().references("User.id").onDelete("cascade"))
    .addColumn("hash", "text", (c) => c.notNull())
    .addColumn("updated_at", "text", (c) => c.notNull())
    .execute();

  await db.schema
    .createTable("profiles")
    .addColumn("user_id", "text", (c) => c.primaryKey().references("User.id").onDelete("cascade"))
    .addColumn("name", "text", (c) => c.notNull())
    .addColumn("bio", "text", (c) => c.notNull().defaultTo(""))
    .addColumn("role", "text", (c) =>
      c.notNull().defaultTo("member").check(sql`role in ('member', 'moderator', 'admin')`),
    )
    .addColumn("standing", "text", (c) =>
      c.notNull().defaultTo("new").check(sql`standing in ('new', 'trusted')`),
    )
    .addColumn("suspended_until", "text")
    .addColumn("is_demo", "integer", (c) => c.notNull().defaultTo(0))
    .addColumn("created_at", "text", (c) => c.notNull())
    .addColumn("updated_at", "text", (c) => c.notNull())
    .execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  for (const t of ["profiles", "passwords", "VerificationToken", "Session", "Account", "User"]) {
    await db.schema.dropTable(t).execute();
  }
}
