import SQLite from "better-sqlite3";
import { Kysely, SqliteDialect, type Transaction } from "kysely";
import type { Database } from "./schema";

export type Db = Kysely<Database>;
export type DbOrTx = Kysely<Database> | Transaction<Database>;

export function openDatabase(file: string): Db {
  const sqlite = new SQLite(file);
  sqlite.pragma("journal_mode = WAL");
  sqlite.pragma("foreign_keys = ON");
  sqlite.pragma("busy_timeout = 5000");
  // FULL keeps the last commits across a power cut, not only a process crash.
  sqlite.pragma("synchronous = FULL");
  return new Kysely<Database>({ dialect: new SqliteDialect({ database: sqlite }) });
}

export const nowIso = () => new Date().toISOString();
