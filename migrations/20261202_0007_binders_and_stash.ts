import { sql, type Kysely } from "kysely";

export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable("binders")
    .addColumn("id", "integer", (c) => c.primaryKey().autoIncrement())
    .addColumn("owner_id", "text", (c) => c.notNull().references("User.id").onDelete("cascade"))
    .addColumn("name", "text", (c) => c.notNull())
    .addColumn("description", "text", (c) => c.notNull().defaultTo(""))
    .addColumn("visibility", "text", (c) => c.notNull().check(sql`visibility in ('private', 'public')`))
    .addColumn("created_at", "text", (c) => c.notNull())
    .addColumn("updated_at", "text", (c) => c.notNull())
    .execute();
  await db.schema.createIndex("binders_owner").on("binders").columns(["owner_id", "id"]).execute();

  await db.schema
    .createTable("binder_items")
    .addColumn("binder_id", "integer", (c) => c.notNull().references("binders.id").onDelete("cascade"))
    .addColumn("strip_id", "integer", (c) => c.notNull().references("strips.id").onDelete("cascade"))
    .addColumn("position", "integer", (c) => c.notNull())
    .addColumn("note", "text", (c) => c.notNull().defaultTo(""))
    .addColumn("added_at", "text", (c) => c.notNull())
    .addPrimaryKeyConstraint("binder_items_pk", ["binder_id", "strip_id"])
    .execute();
  await db.schema.createIndex("binder_items_strip").on("binder_items").column("strip_id").execute();

  await db.schema
    .createTable("stash_items")
    .addColumn("user_id", "text", (c) => c.notNull().references("User.id").onDelete("cascade"))
    .addColumn("ink_id", "integer", (c) => c.notNull().references("inks.id").onDelete("cascade"))
    .addColumn("running_low", "integer", (c) => c.notNull().defaultTo(0))
    .addColumn("added_at", "text", (c) => c.notNull())
    .addPrimaryKeyConstraint("stash_items_pk", ["user_id", "ink_id"])
    .execute();
  await db.schema.createIndex("stash_items_ink").on("stash_items").column("ink_id").execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable("stash_items").execute();
  await db.schema.dropTable("binder_items").execute();
  await db.schema.dropTable("binders").execute();
}
