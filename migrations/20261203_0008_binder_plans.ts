import type { Kysely } from "kysely";

// Planned strips kept in a binder (issue 16): a plan is only its inks in order, so it is stored
// as a JSON array of ink ids rather than as a strip (it has no photo, bands or review).
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable("binder_plans")
    .addColumn("id", "integer", (c) => c.primaryKey().autoIncrement())
    .addColumn("binder_id", "integer", (c) => c.notNull().references("binders.id").onDelete("cascade"))
    .addColumn("ink_ids", "text", (c) => c.notNull())
    .addColumn("added_at", "text", (c) => c.notNull())
    .execute();
  await db.schema.createIndex("binder_plans_binder").on("binder_plans").columns(["binder_id", "id"]).execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable("binder_plans").execute();
}
