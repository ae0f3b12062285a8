import type { Migration } from "kysely";
import * as m0001 from "./20261202_0001_accounts";
import * as m0002 from "./20261202_0002_catalogue";
import * as m0003 from "./20261202_0003_uploads";
import * as m0004 from "./20261202_0004_strips";
import * as m0005 from "./20261202_0005_moderation";
import * as m0006 from "./20261202_0006_search_index";
import * as m0007 from "./20261202_0007_binders_and_stash";
import * as m0008 from "./20261210_0008_strips_per_upload";
import * as m0009 from "./20261212_0008_member_sessions";
import * as m0010 from "./20261203_0008_binder_plans";

// Every migration, by name (the names sort in the order they run). Add new files here;
// never edit one that has run.
export const migrations: Record<string, Migration> = {
  "20261202_0001_accounts": m0001,
  "20261202_0002_catalogue": m0002,
  "20261202_0003_uploads": m0003,
  "20261202_0004_strips": m0004,
  "20261202_0005_moderation": m0005,
  "20261202_0006_search_index": m0006,
  "20261202_0007_binders_and_stash": m0007,
  "20261203_0008_binder_plans": m0010,
  "20261210_0008_strips_per_upload": m0008,
  "20261212_0008_member_sessions": m0009,
};
