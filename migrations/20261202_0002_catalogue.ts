import { sql, type Kysely } from "kysely";

export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable("brands")
    .addColumn("id", "integer", (c) => c.primaryKey().autoIncrement())
    .addColumn("slug", "text", (c) => c.notNull().unique())
    .addColumn("name", "text", (c) => c.notNull())
    .addColumn("created_at", "text", (c) => c.notNull())
    .execute();
  await sql`create unique index brands_name_nocase on brands (name collate nocase)`.execute(db);

  await db.schema
    .createTable("inks")
    .addColumn("id", "integer", (c) => c.primaryKey().autoIncrement())
    .addColumn("brand_id", "integer", (c) => c.notNull().references("brands.id").onDelete("restrict"))
    .addColumn("name", "text", (c) => c.notNull())
    .addColumn("type", "text", (c) => c.notNull().check(sql`type in ('dye', 'pigment', 'hybrid')`))
    .addColumn("hex", "text", (c) => c.notNull().check(sql`hex glob '#[0-9a-f][0-9a-f][0-9a-f][0-9a-f][0-9a-f][0-9a-f]'`))
    // Reference colour, CIELAB with a D65 white.
    .addColumn("lab_l", "real", (c) => c.notNull())
    .addColumn("lab_a", "real", (c) => c.notNull())
    .addColumn("lab_b", "real", (c) => c.notNull())
    .addColumn("discontinued", "integer", (c) => c.notNull().defaultTo(0))
    .addColumn("created_at", "text", (c) => c.notNull())
    .addColumn("updated_at", "text", (c) => c.notNull())
    .execute();
  await sql`create unique index inks_brand_name on inks (brand_id, name collate nocase)`.execute(db);
  await sql`create index inks_name on inks (name collate nocase)`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable("inks").execute();
  await db.schema.dropTable("brands").execute();
}
