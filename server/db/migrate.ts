import { Migrator, type MigrationResultSet } from "kysely";
import { migrations } from "../../migrations";
import type { Db } from "./client";

// A static list rather than a folder scan: the same code runs under tsx, vitest and a bundle.
export function createMigrator(db: Db): Migrator {
  return new Migrator({ db, provider: { getMigrations: async () => migrations } });
}

function check(result: MigrationResultSet): MigrationResultSet {
  if (result.error) {
    const failed = result.results?.find((r) => r.status === "Error");
    const where = failed ? ` in ${failed.migrationName}` : "";
    throw new Error(`Migration failed${where}: ${String(result.error)}`, { cause: result.error });
  }
  return result;
}

export async function migrateToLatest(db: Db): Promise<MigrationResultSet> {
  return check(await createMigrator(db).migrateToLatest());
}

export async function migrateDown(db: Db): Promise<MigrationResultSet> {
  return check(await createMigrator(db).migrateDown());
}
