import type { Kysely } from "kysely";

// One row per signed-in session; the session cookie (a JWT) carries the row's id, and every
// request checks the row, so a session can be ended on the server (docs/decisions/006).
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable("member_sessions")
    .addColumn("id", "text", (c) => c.primaryKey())
    .addColumn("user_id", "text", (c) => c.notNull().references("User.id").onDelete("cascade"))
    .addColumn("created_at", "text", (c) => c.notNull())
    .addColumn("last_seen_at", "text", (c) => c.notNull())
    .addColumn("expires_at", "text", (c) => c.notNull())
    .addColumn("ended_at", "text")
    .addColumn("ended_reason", "text")
    .execute();
  await db.schema.createIndex("member_sessions_user").on("member_sessions").columns(["user_id", "ended_at"]).execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable("member_sessions").execute();
}
