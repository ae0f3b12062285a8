import { sql, type Kysely } from "kysely";

export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable("strips")
    .addColumn("id", "integer", (c) => c.primaryKey().autoIncrement())
    .addColumn("author_id", "text", (c) => c.notNull().references("User.id").onDelete("cascade"))
    .addColumn("upload_id", "text", (c) => c.notNull().unique().references("uploads.id").onDelete("restrict"))
    .addColumn("title", "text", (c) => c.notNull())
    .addColumn("notes_html", "text", (c) => c.notNull().defaultTo(""))
    .addColumn("paper", "text", (c) => c.notNull())
    .addColumn("tools_json", "text", (c) => c.notNull().defaultTo("[]"))
    .addColumn("video_url", "text")
    .addColumn("status", "text", (c) =>
      c.notNull().check(sql`status in ('pending', 'published', 'hidden', 'returned', 'rejected')`),
    )
    .addColumn("status_reason", "text")
    .addColumn("version", "integer", (c) => c.notNull().defaultTo(1))
    .addColumn("orientation", "text", (c) => c.notNull().check(sql`orientation in ('horizontal', 'vertical')`))
    .addColumn("ink_count", "integer", (c) => c.notNull())
    .addColumn("saves", "integer", (c) => c.notNull().defaultTo(0))
    .addColumn("phash", "text")
    .addColumn("created_at", "text", (c) => c.notNull())
    .addColumn("updated_at", "text", (c) => c.notNull())
    .addColumn("published_at", "text")
    .execute();
  await db.schema.createIndex("strips_status_published").on("strips").columns(["status", "published_at", "id"]).execute();
  await db.schema.createIndex("strips_status_saves").on("strips").columns(["status", "saves", "id"]).execute();
  await db.schema.createIndex("strips_author").on("strips").columns(["author_id", "created_at"]).execute();
  await db.schema.createIndex("strips_phash").on("strips").column("phash").execute();

  await db.schema
    .createTable("strip_inks")
    .addColumn("strip_id", "integer", (c) => c.notNull().references("strips.id").onDelete("cascade"))
    .addColumn("position", "integer", (c) => c.notNull())
    .addColumn("ink_id", "integer", (c) => c.notNull().references("inks.id").onDelete("restrict"))
    .addPrimaryKeyConstraint("strip_inks_pk", ["strip_id", "position"])
    .addUniqueConstraint("strip_inks_unique_ink", ["strip_id", "ink_id"])
    .execute();
  await db.schema.createIndex("strip_inks_ink").on("strip_inks").columns(["ink_id", "strip_id"]).execute();

  await db.schema
    .createTable("strip_bands")
    .addColumn("strip_id", "integer", (c) => c.notNull().references("strips.id").onDelete("cascade"))
    .addColumn("position", "integer", (c) => c.notNull())
    .addColumn("start_frac", "real", (c) => c.notNull())
    .addColumn("end_frac", "real", (c) => c.notNull())
    .addColumn("lab_l", "real", (c) => c.notNull())
    .addColumn("lab_a", "real", (c) => c.notNull())
    .addColumn("lab_b", "real", (c) => c.notNull())
    .addColumn("hex", "text", (c) => c.notNull())
    .addColumn("ink_id", "integer", (c) => c.references("inks.id").onDelete("set null"))
    .addColumn("delta_e", "real")
    .addPrimaryKeyConstraint("strip_bands_pk", ["strip_id", "position"])
    .execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable("strip_bands").execute();
  await db.schema.dropTable("strip_inks").execute();
  await db.schema.dropTable("strips").execute();
}
