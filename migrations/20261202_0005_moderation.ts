import { sql, type Kysely } from "kysely";

export async function up(db: Kysely<any>): Promise<void> {
  // The audit trail: written once, never updated or deleted through the app.
  await db.schema
    .createTable("moderation_actions")
    .addColumn("id", "integer", (c) => c.primaryKey().autoIncrement())
    // null: Blendwell itself (an automatic hold).
    .addColumn("moderator_id", "text", (c) => c.references("User.id").onDelete("restrict"))
    .addColumn("action", "text", (c) => c.notNull())
    .addColumn("strip_id", "integer", (c) => c.references("strips.id").onDelete("set null"))
    .addColumn("member_id", "text", (c) => c.references("User.id").onDelete("set null"))
    .addColumn("reason", "text", (c) => c.notNull())
    .addColumn("note", "text", (c) => c.notNull().defaultTo(""))
    .addColumn("before_state", "text")
    .addColumn("after_state", "text")
    .addColumn("detail_json", "text")
    .addColumn("created_at", "text", (c) => c.notNull())
    .execute();
  await db.schema.createIndex("moderation_actions_strip").on("moderation_actions").columns(["strip_id", "id"]).execute();
  await db.schema.createIndex("moderation_actions_member").on("moderation_actions").columns(["member_id", "id"]).execute();
  await db.schema.createIndex("moderation_actions_moderator").on("moderation_actions").columns(["moderator_id", "id"]).execute();
  await sql`create trigger moderation_actions_no_update before update on moderation_actions
    begin select raise(abort, 'the audit trail is append-only'); end`.execute(db);
  await sql`create trigger moderation_actions_no_delete before delete on moderation_actions
    begin select raise(abort, 'the audit trail is append-only'); end`.execute(db);

  await db.schema
    .createTable("reports")
    .addColumn("id", "integer", (c) => c.primaryKey().autoIncrement())
    .addColumn("strip_id", "integer", (c) => c.notNull().references("strips.id").onDelete("cascade"))
    .addColumn("reporter_id", "text", (c) => c.notNull().references("User.id").onDelete("cascade"))
    .addColumn("reason", "text", (c) => c.notNull())
    .addColumn("note", "text", (c) => c.notNull().defaultTo(""))
    .addColumn("status", "text", (c) => c.notNull().defaultTo("open").check(sql`status in ('open', 'handled')`))
    .addColumn("created_at", "text", (c) => c.notNull())
    .addColumn("handled_at", "text")
    .addUniqueConstraint("reports_once", ["strip_id", "reporter_id"])
    .execute();
  await db.schema.createIndex("reports_open").on("reports").columns(["status", "strip_id"]).execute();

  // Why a strip waits in the review queue besides being pending: held for reports or as a duplicate.
  await db.schema.alterTable("strips").addColumn("hold", "text").execute();
  await db.schema.alterTable("strips").addColumn("duplicate_of", "integer").execute();

  await db.schema
    .createTable("notices")
    .addColumn("id", "integer", (c) => c.primaryKey().autoIncrement())
    .addColumn("user_id", "text", (c) => c.notNull().references("User.id").onDelete("cascade"))
    .addColumn("kind", "text", (c) => c.notNull())
    .addColumn("strip_id", "integer", (c) => c.references("strips.id").onDelete("set null"))
    .addColumn("title", "text", (c) => c.notNull())
    .addColumn("body", "text", (c) => c.notNull())
    .addColumn("created_at", "text", (c) => c.notNull())
    .addColumn("read_at", "text")
    .execute();
  await db.schema.createIndex("notices_user").on("notices").columns(["user_id", "id"]).execute();

  // Outgoing mail, sent by a background loop with retries so a moderator never waits on SMTP.
  await db.schema
    .createTable("mail_outbox")
    .addColumn("id", "integer", (c) => c.primaryKey().autoIncrement())
    .addColumn("to_address", "text", (c) => c.notNull())
    .addColumn("subject", "text", (c) => c.notNull())
    .addColumn("text", "text", (c) => c.notNull())
    .addColumn("attempts", "integer", (c) => c.notNull().defaultTo(0))
    .addColumn("next_attempt_at", "text", (c) => c.notNull())
    .addColumn("sent_at", "text")
    .addColumn("last_error", "text")
    .addColumn("created_at", "text", (c) => c.notNull())
    .execute();
  await db.schema.createIndex("mail_outbox_due").on("mail_outbox").columns(["sent_at", "next_attempt_at"]).execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable("mail_outbox").execute();
  await db.schema.dropTable("notices").execute();
  await db.schema.alterTable("strips").dropColumn("duplicate_of").execute();
  await db.schema.alterTable("strips").dropColumn("hold").execute();
  await db.schema.dropTable("reports").execute();
  await db.schema.dropTable("moderation_actions").execute();
}
