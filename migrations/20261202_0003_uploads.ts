import { sql, type Kysely } from "kysely";

// An uploaded photo and its analysis. The original stays private (for re-analysis);
// only derivatives without metadata are ever served.
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable("uploads")
    .addColumn("id", "text", (c) => c.primaryKey())
    .addColumn("owner_id", "text", (c) => c.notNull().references("User.id").onDelete("cascade"))
    .addColumn("status", "text", (c) => c.notNull().check(sql`status in ('processing', 'ready', 'failed')`))
    .addColumn("original_key", "text")
    .addColumn("mime", "text", (c) => c.notNull())
    .addColumn("byte_size", "integer", (c) => c.notNull())
    .addColumn("white_x", "real")
    .addColumn("white_y", "real")
    .addColumn("attempts", "integer", (c) => c.notNull().defaultTo(0))
    .addColumn("analysis_json", "text")
    .addColumn("display_key", "text")
    .addColumn("thumb_key", "text")
    .addColumn("placeholder", "text")
    .addColumn("phash", "text")
    .addColumn("width", "integer")
    .addColumn("height", "integer")
    .addColumn("error_code", "text")
    .addColumn("error_message", "text")
    .addColumn("created_at", "text", (c) => c.notNull())
    .addColumn("updated_at", "text", (c) => c.notNull())
    .execute();
  await db.schema.createIndex("uploads_owner").on("uploads").columns(["owner_id", "created_at"]).execute();
  await db.schema.createIndex("uploads_status").on("uploads").column("status").execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable("uploads").execute();
}
