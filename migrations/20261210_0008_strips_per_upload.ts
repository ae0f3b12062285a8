import { sql, type Kysely } from "kysely";

// Several strips from one photo (issue 11): a strip names which strip of its upload it is
// (strip_index, unique per upload), and a strip cut from a several-strip photo has display and
// thumbnail images of its own (null: the upload's), with its outline relative to its own image.
//
// strips.upload_id was declared UNIQUE on the column, which SQLite cannot drop, so the table is
// rebuilt the way SQLite's manual says for changes ALTER TABLE cannot make ("Making Other Kinds
// Of Table Schema Changes", sqlite.org/lang_altertable.html): foreign keys off, new table, copy,
// drop, rename, indexes again, foreign_key_check, then foreign keys on. The Migrator runs SQLite
// migrations outside a transaction, so the pragma takes effect; the rebuild runs in one.

const columns = `id, author_id, upload_id, title, notes_html, paper, tools_json, video_url, status, status_reason, version,
  orientation, ink_count, saves, phash, created_at, updated_at, published_at, hold, duplicate_of`;

const table = (name: string, perUpload: boolean) => `create table "${name}" (
  "id" integer primary key autoincrement,
  "author_id" text not null references "User" ("id") on delete cascade,
  "upload_id" text not null ${perUpload ? "" : "unique "}references "uploads" ("id") on delete restrict,
  "title" text not null,
  "notes_html" text default '' not null,
  "paper" text not null,
  "tools_json" text default '[]' not null,
  "video_url" text,
  "status" text not null check (status in ('pending', 'published', 'hidden', 'returned', 'rejected')),
  "status_reason" text,
  "version" integer default 1 not null,
  "orientation" text not null check (orientation in ('horizontal', 'vertical')),
  "ink_count" integer not null,
  "saves" integer default 0 not null,
  "phash" text,
  "created_at" text not null,
  "updated_at" text not null,
  "published_at" text,
  "hold" text,
  "duplicate_of" integer${
    perUpload
      ? `,
  "strip_index" integer default 0 not null check (strip_index >= 0),
  "display_key" text,
  "thumb_key" text,
  "placeholder" text,
  "width" integer,
  "height" integer,
  "outline_json" text,
  constraint "strips_upload_strip" unique ("upload_id", "strip_index")`
      : ""
  }
)`;

const indexes = [
  `create index "strips_status_published" on "strips" ("status", "published_at", "id")`,
  `create index "strips_status_saves" on "strips" ("status", "saves", "id")`,
  `create index "strips_author" on "strips" ("author_id", "created_at")`,
  `create index "strips_phash" on "strips" ("phash")`,
  // From 0006: search reads published strips' sort keys from this partial index.
  `create index strips_search_visible on strips (id, published_at, saves) where status = 'published'`,
];

async function rebuild(db: Kysely<any>, perUpload: boolean) {
  await sql`pragma foreign_keys = off`.execute(db);
  try {
    await db.transaction().execute(async (tx) => {
      const seq = await sql<{ seq: number }>`select seq from sqlite_sequence where name = 'strips'`.execute(tx);
      await sql.raw(table("strips_rebuilt", perUpload)).execute(tx);
      await sql.raw(`insert into strips_rebuilt (${columns}) select ${columns} from strips`).execute(tx);
      await sql`drop table strips`.execute(tx);
      await sql`alter table strips_rebuilt rename to strips`.execute(tx);
      for (const index of indexes) await sql.raw(index).execute(tx);
      // Keep AUTOINCREMENT's promise: ids of deleted strips are never handed out again.
      const last = seq.rows[0]?.seq;
      if (last !== undefined) await sql`update sqlite_sequence set seq = max(seq, ${last}) where name = 'strips'`.execute(tx);
      const broken = await sql`pragma foreign_key_check`.execute(tx);
      if (broken.rows.length) throw new Error(`rebuilding strips broke ${broken.rows.length} foreign key(s)`);
    });
  } finally {
    await sql`pragma foreign_keys = on`.execute(db);
  }
}

export async function up(db: Kysely<any>): Promise<void> {
  await rebuild(db, true);
}

export async function down(db: Kysely<any>): Promise<void> {
  const shared = await sql<{ n: number }>`select count(*) as n from (select upload_id from strips group by upload_id having count(*) > 1)`.execute(db);
  if (Number(shared.rows[0]?.n ?? 0) > 0) {
    throw new Error("Some photos are posted as several strips; the schema before 0008 allows one strip per photo. Delete those strips first.");
  }
  await rebuild(db, false);
}
