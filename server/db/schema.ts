import type { SearchTables } from "../modules/search/search-tables";
import type { Generated, Insertable, Selectable, Updateable } from "kysely";

// Types match what SQLite returns: booleans as 0/1, timestamps as ISO text.

export interface UserTable {
  id: string;
  name: string | null;
  email: string;
  emailVerified: string | null;
  image: string | null;
}

export interface AccountTable {
  userId: string;
  type: string;
  provider: string;
  providerAccountId: string;
  refresh_token: string | null;
  access_token: string | null;
  expires_at: number | null;
  token_type: string | null;
  scope: string | null;
  id_token: string | null;
  session_state: string | null;
}

export interface SessionTable {
  sessionToken: string;
  userId: string;
  expires: string;
}

export interface VerificationTokenTable {
  identifier: string;
  token: string;
  expires: string;
}

export interface PasswordTable {
  user_id: string;
  hash: string;
  updated_at: string;
}

export interface ProfileTable {
  user_id: string;
  name: string;
  bio: Generated<string>;
  role: Generated<"member" | "moderator" | "admin">;
  standing: Generated<"new" | "trusted">;
  suspended_until: string | null;
  is_demo: Generated<0 | 1>;
  created_at: string;
  updated_at: string;
}

export interface BrandTable {
  id: Generated<number>;
  slug: string;
  name: string;
  created_at: string;
}

export interface InkTable {
  id: Generated<number>;
  brand_id: number;
  name: string;
  type: "dye" | "pigment" | "hybrid";
  hex: string;
  lab_l: number;
  lab_a: number;
  lab_b: number;
  discontinued: Generated<0 | 1>;
  created_at: string;
  updated_at: string;
}

export interface UploadTable {
  id: string;
  owner_id: string;
  status: "processing" | "ready" | "failed";
  original_key: string | null;
  mime: string;
  byte_size: number;
  white_x: number | null;
  white_y: number | null;
  attempts: Generated<number>;
  analysis_json: string | null;
  display_key: string | null;
  thumb_key: string | null;
  placeholder: string | null;
  phash: string | null;
  width: number | null;
  height: number | null;
  error_code: string | null;
  error_message: string | null;
  created_at: string;
  updated_at: string;
}

export interface StripTable {
  id: Generated<number>;
  author_id: string;
  upload_id: string;
  title: string;
  notes_html: string;
  paper: "smooth-cardstock" | "hot-press" | "cold-press" | "mixed-media" | "other";
  tools_json: string;
  video_url: string | null;
  status: "pending" | "published" | "hidden" | "returned" | "rejected";
  status_reason: string | null;
  version: Generated<number>;
  orientation: "horizontal" | "vertical";
  ink_count: number;
  saves: Generated<number>;
  phash: string | null;
  created_at: string;
  updated_at: string;
  published_at: string | null;
  /** Held out of public view until a moderator decides: "reports" or "duplicate". */
  hold: "reports" | "duplicate" | null;
  duplicate_of: number | null;
  /** Which strip of its upload's analysis this is (unique per upload). */
  strip_index: Generated<number>;
  /** A strip cut from a several-strip photo has images of its own; null: the upload's. */
  display_key: string | null;
  thumb_key: string | null;
  placeholder: string | null;
  width: number | null;
  height: number | null;
  /** The strip's corners as fractions of its own display image (JSON Outline), when known. */
  outline_json: string | null;
}

export interface StripInkTable {
  strip_id: number;
  position: number;
  ink_id: number;
}

export interface StripBandTable {
  strip_id: number;
  position: number;
  start_frac: number;
  end_frac: number;
  lab_l: number;
  lab_a: number;
  lab_b: number;
  hex: string;
  ink_id: number | null;
  delta_e: number | null;
}

export interface ModerationActionTable {
  id: Generated<number>;
  moderator_id: string | null;
  action: string;
  strip_id: number | null;
  member_id: string | null;
  reason: string;
  note: string;
  before_state: string | null;
  after_state: string | null;
  detail_json: string | null;
  created_at: string;
}

export interface ReportTable {
  id: Generated<number>;
  strip_id: number;
  reporter_id: string;
  reason: string;
  note: string;
  status: Generated<"open" | "handled">;
  created_at: string;
  handled_at: string | null;
}

export interface NoticeTable {
  id: Generated<number>;
  user_id: string;
  kind: string;
  strip_id: number | null;
  title: string;
  body: string;
  created_at: string;
  read_at: string | null;
}

export interface MailOutboxTable {
  id: Generated<number>;
  to_address: string;
  subject: string;
  text: string;
  attempts: Generated<number>;
  next_attempt_at: string;
  sent_at: string | null;
  last_error: string | null;
  created_at: string;
}

export interface BinderTable {
  id: Generated<number>;
  owner_id: string;
  name: string;
  description: string;
  visibility: "private" | "public";
  created_at: string;
  updated_at: string;
}

export interface BinderItemTable {
  binder_id: number;
  strip_id: number;
  position: number;
  note: string;
  added_at: string;
}

export interface BinderPlanTable {
  id: Generated<number>;
  binder_id: number;
  /** JSON array of ink ids, in order (2–6). */
  ink_ids: string;
  added_at: string;
}

export interface StashItemTable {
  user_id: string;
  ink_id: number;
  running_low: 0 | 1;
  added_at: string;
}

export interface MemberSessionTable {
  id: string;
  user_id: string;
  created_at: string;
  last_seen_at: string;
  /** Absolute end, however active the session is. */
  expires_at: string;
  ended_at: string | null;
  ended_reason: string | null;
}

export interface Database extends SearchTables {
  User: UserTable;
  Account: AccountTable;
  Session: SessionTable;
  VerificationToken: VerificationTokenTable;
  passwords: PasswordTable;
  profiles: ProfileTable;
  brands: BrandTable;
  inks: InkTable;
  uploads: UploadTable;
  strips: StripTable;
  strip_inks: StripInkTable;
  strip_bands: StripBandTable;
  moderation_actions: ModerationActionTable;
  reports: ReportTable;
  notices: NoticeTable;
  mail_outbox: MailOutboxTable;
  binders: BinderTable;
  binder_items: BinderItemTable;
  binder_plans: BinderPlanTable;
  stash_items: StashItemTable;
  member_sessions: MemberSessionTable;
}

export type Profile = Selectable<ProfileTable>;
export type NewProfile = Insertable<ProfileTable>;
export type Brand = Selectable<BrandTable>;
export type InkRow = Selectable<InkTable>;
export type NewInk = Insertable<InkTable>;
export type InkUpdate = Updateable<InkTable>;
export type UploadRow = Selectable<UploadTable>;
export type StripRow = Selectable<StripTable>;
