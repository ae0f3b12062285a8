import type { z } from "zod";
import { deltaE2000, type Lab } from "../../../shared/colour";
import type { Me } from "../../../shared/schemas/accounts";
import { randomBytes } from "node:crypto";
import { dirname } from "node:path";
import { stripReadings } from "../../../shared/schemas/outlines";
import type { Analysis, AnalysisBand, Outline } from "../../../shared/schemas/uploads";
import type { Strip, stripInput, stripPatch, MemberProfile } from "../../../shared/schemas/strips";
import { nowIso, type Db, type DbOrTx } from "../../db/client";
import type { StripRow, UploadRow } from "../../db/schema";
import { AppError, notFound } from "../../middleware/errors";
import type { FileStore } from "../../storage/file-store";
import { cropDerivatives, phashDistance } from "../../images";
import type { StripSearchQuery } from "../../../shared/schemas/search";
import { searchStripList } from "../search/search.service";
import { DRAFT_DAYS } from "../uploads/uploads.service";
import { cleanNotes } from "./notes-html";
import { cropFor } from "./strip-crop";
import * as repo from "./strips.repository";

type StripInput = z.output<typeof stripInput>;
type StripPatch = z.output<typeof stripPatch>;

export const isModerator = (viewer: Me | null) => !!viewer && viewer.role !== "member";

/** The one visibility rule: published strips for everyone, the rest for the author and moderators. */
export function canViewStrip(strip: Pick<StripRow, "status" | "author_id">, viewer: Me | null) {
  return strip.status === "published" || (!!viewer && (viewer.id === strip.author_id || isModerator(viewer)));
}

export function isSuspended(me: Me, now = new Date()) {
  return !!me.suspendedUntil && new Date(me.suspendedUntil) > now;
}

function assertCanContribute(me: Me) {
  if (isSuspended(me)) {
    throw new AppError("suspended", `Your account is suspended until ${me.suspendedUntil?.slice(0, 10)}; you cannot post for now.`, 403);
  }
}

/** Hashes at most this many bits apart are the same photo, re-encoded or lightly edited (ours). */
export const DUPLICATE_BITS = 6;
/** …and every band within this ΔE2000 of the other strip's (ours: "similar" at most). */
export const DUPLICATE_BAND_DE = 4;

/**
 * A near-duplicate needs both a close perceptual hash and the same bands: strip photos share one
 * layout (a band across white card), so the hash alone would call different strips the same.
 */
async function findDuplicate(db: DbOrTx, phash: string | null, bands: AnalysisBand[]) {
  if (!phash) return null;
  for (const other of await repo.listPhashes(db)) {
    if (!other.phash || other.phash.length !== phash.length || phashDistance(other.phash, phash) > DUPLICATE_BITS) continue;
    const theirs = await db.selectFrom("strip_bands").selectAll().where("strip_id", "=", other.id).orderBy("position").execute();
    const same =
      theirs.length === bands.length &&
      theirs.every((b, i) => deltaE2000({ l: b.lab_l, a: b.lab_a, b: b.lab_b }, bands[i]!.lab as Lab) <= DUPLICATE_BAND_DE);
    if (same) return other.id;
  }
  return null;
}

export function stripImageUrl(id: number, variant: "display" | "thumb") {
  return `/api/strips/${id}/images/${variant}`;
}

const round = (n: number) => Math.round(n * 100) / 100;

function toStrips(rows: StripRow[], parts: Awaited<ReturnType<typeof repo.loadStripParts>>): Strip[] {
  const names = new Map(parts.authors.map((a) => [a.user_id, a.name]));
  const uploads = new Map(parts.uploads.map((u) => [u.id, u]));
  return rows.map((s) => {
    const up = uploads.get(s.upload_id);
    return {
      id: s.id,
      title: s.title,
      status: s.status,
      statusReason: s.status_reason,
      author: { id: s.author_id, name: names.get(s.author_id) ?? "A member" },
      inks: parts.inks
        .filter((i) => i.strip_id === s.id)
        .map((i) => ({ id: i.id, name: i.name, brand: i.brand, hex: i.hex, lab: { l: i.lab_l, a: i.lab_a, b: i.lab_b } })),
      bands: parts.bands
        .filter((b) => b.strip_id === s.id)
        .map((b) => ({
          index: b.position,
          start: b.start_frac,
          end: b.end_frac,
          hex: b.hex,
          lab: { l: b.lab_l, a: b.lab_a, b: b.lab_b },
          inkId: b.ink_id,
          deltaE: b.delta_e,
        })),
      orientation: s.orientation,
      stripIndex: s.strip_index,
      outline: s.outline_json ? (JSON.parse(s.outline_json) as Outline) : null,
      // A strip cut from a several-strip photo has images of its own; otherwise it shows the upload's.
      images: {
        display: stripImageUrl(s.id, "display"),
        thumb: stripImageUrl(s.id, "thumb"),
        placeholder: (s.display_key ? s.placeholder : up?.placeholder) ?? "",
        width: (s.display_key ? s.width : up?.width) ?? 0,
        height: (s.display_key ? s.height : up?.height) ?? 0,
      },
      paper: s.paper,
      tools: JSON.parse(s.tools_json),
      videoUrl: s.video_url,
      notes: s.notes_html,
      saves: s.saves,
      version: s.version,
      createdAt: s.created_at,
      updatedAt: s.updated_at,
      publishedAt: s.published_at,
    };
  });
}

export async function hydrate(db: DbOrTx, rows: StripRow[]) {
  return toStrips(rows, await repo.loadStripParts(db, rows));
}

async function checkedInks(db: DbOrTx, ids: number[]) {
  const found = await repo.findInksByIds(db, ids);
  const known = new Set(found.map((i) => i.id));
  const missing = ids.filter((id) => !known.has(id));
  if (missing.length) {
    throw new AppError("unknown_inks", "Some inks are not in the catalogue.", 422, {
      inks: [`unknown ink id${missing.length > 1 ? "s" : ""}: ${missing.join(", ")}`],
    });
  }
  return ids.map((id) => found.find((i) => i.id === id)!);
}

/** The bands of one strip of an analysis (strips[stripIndex]; an old one-strip analysis has only 0). */
export function bandsOf(analysis: Analysis, stripIndex: number): AnalysisBand[] {
  return stripReadings(analysis)[stripIndex]?.bands ?? [];
}

/** Each measured band is tagged with the nearest of the member's inks (ΔE2000). */
export function tagBands(bands: AnalysisBand[], inks: { id: number; lab_l: number; lab_a: number; lab_b: number }[]) {
  return bands.map((band) => {
    let best: { inkId: number; deltaE: number } | null = null;
    for (const ink of inks) {
      const de = deltaE2000(band.lab as Lab, { l: ink.lab_l, a: ink.lab_a, b: ink.lab_b });
      if (!best || de < best.deltaE) best = { inkId: ink.id, deltaE: round(de) };
    }
    return { start: band.start, end: band.end, lab: band.lab, hex: band.hex, inkId: best?.inkId ?? null, deltaE: best?.deltaE ?? null };
  });
}

export function createStripsService(deps: { db: Db; store: FileStore }) {
  const { db, store } = deps;

  async function getRow(id: number, viewer: Me | null) {
    const row = await repo.findStrip(db, id);
    if (!row || !canViewStrip(row, viewer)) throw notFound("That strip");
    return row;
  }

  async function authorRow(id: number, me: Me, from: DbOrTx = db) {
    const row = await repo.findStrip(from, id);
    if (!row || !canViewStrip(row, me)) throw notFound("That strip");
    if (row.author_id !== me.id) throw new AppError("forbidden", "Only the author can change this strip.", 403);
    return row;
  }

  /** The checks a post must pass, in the order members meet them; read again inside the transaction. */
  async function postable(from: DbOrTx, me: Me, input: StripInput) {
    const upload = await repo.findUploadOf(from, input.uploadId);
    if (!upload || upload.owner_id !== me.id) {
      throw new AppError("unknown_upload", "That photo upload was not found.", 422, { uploadId: ["is not one of your uploads"] });
    }
    if (upload.status !== "ready" || !upload.analysis_json) {
      const why = upload.status === "processing" ? "is still being analysed" : "could not be analysed; upload the photo again";
      throw new AppError("upload_not_ready", `That photo ${why}.`, 422, { uploadId: [why] });
    }
    const analysis = JSON.parse(upload.analysis_json) as Analysis;
    const size = upload.width && upload.height ? { width: upload.width, height: upload.height } : undefined;
    const readings = stripReadings(analysis, size);
    const reading = readings[input.stripIndex];
    if (!reading) {
      const has = readings.length === 1 ? "one strip (number 0)" : `${readings.length} strips (numbers 0–${readings.length - 1})`;
      throw new AppError("unknown_strip", `This photo has ${has}; there is no strip ${input.stripIndex}.`, 422, { stripIndex: [`this photo has ${has}`] });
    }
    if (await repo.findStripByUpload(from, upload.id, input.stripIndex)) {
      const what = readings.length === 1 ? "This photo is already posted as a strip." : `Strip ${input.stripIndex + 1} of this photo is already posted.`;
      throw new AppError("already_posted", what, 409, { uploadId: ["is already posted"] });
    }
    const inks = await checkedInks(from, input.inks);
    return { upload, reading, inks, outline: reading.outline, several: readings.length > 1 };
  }

  type OwnImages = { displayKey: string; thumbKey: string | null };

  /** A strip of a several-strip photo: its own display and thumbnail, cut from the corrected display photo. */
  async function cutOwnImages(upload: UploadRow, outline: Outline, stripIndex: number) {
    if (!upload.display_key || !upload.width || !upload.height) throw new AppError("upload_not_ready", "That photo has no display image yet.", 422);
    const crop = cropFor(outline, upload.width, upload.height);
    // A fresh folder per attempt: two posts of the same strip at once never share files.
    const folder = `images/${upload.id}/strip-${stripIndex}-${randomBytes(6).toString("hex")}`;
    const keys = { displayKey: `${folder}/display.webp`, thumbKey: `${folder}/thumb.webp` };
    try {
      const made = await cropDerivatives(store.pathOf(upload.display_key), crop.box, { displayPath: store.pathOf(keys.displayKey), thumbPath: store.pathOf(keys.thumbKey) });
      return { ...keys, outline: crop.outline, placeholder: made.placeholder, phash: made.phash, width: made.display.width, height: made.display.height };
    } catch (err) {
      await store.removeFolder(folder);
      throw err;
    }
  }

  async function removeOwnImages(own: OwnImages) {
    await store.remove(own.displayKey);
    if (own.thumbKey) await store.remove(own.thumbKey);
    // The folder was made for this strip alone.
    if (/^images\/[^/]+\/strip-[^/]+\/display\.webp$/.test(own.displayKey)) await store.removeFolder(dirname(own.displayKey));
  }

  /** A several-strip photo stays a draft for its other strips while it is younger than the draft week. */
  function draftStillWanted(upload: UploadRow, now = new Date()) {
    if (upload.status !== "ready" || !upload.analysis_json) return false;
    const several = stripReadings(JSON.parse(upload.analysis_json) as Analysis).length > 1;
    return several && Date.parse(upload.updated_at) > now.getTime() - DRAFT_DAYS * 24 * 60 * 60 * 1000;
  }

  return {
    async create(me: Me, input: StripInput) {
      assertCanContribute(me);
      const notes = cleanNotes(input.notes);
      // Everything a member can get wrong is checked before any image work…
      const first = await postable(db, me, input);
      const own = first.several ? await cutOwnImages(first.upload, first.outline!, input.stripIndex) : null;
      try {
        // …and again in the transaction, which must not wait on image work (one SQLite connection).
        return await db.transaction().execute(async (tx) => {
          const { upload, reading, inks, outline } = await postable(tx, me, input);
          if (upload.analysis_json !== first.upload.analysis_json) {
            throw new AppError("upload_changed", "This photo was analysed again while you posted. Check its strips and post again.", 409);
          }
          const now = nowIso();
          const phash = own ? own.phash : upload.phash;
          // A photo that looks like another strip's waits for a moderator, whoever posts it.
          const duplicateOf = await findDuplicate(tx, phash, reading.bands);
          const published = me.standing === "trusted" && duplicateOf === null;
          const id = await repo.insertStrip(tx, {
            author_id: me.id,
            upload_id: upload.id,
            strip_index: input.stripIndex,
            title: input.title,
            notes_html: notes,
            paper: input.paper,
            tools_json: JSON.stringify(input.tools),
            video_url: input.videoUrl ?? null,
            status: published ? "published" : "pending",
            status_reason: null,
            orientation: reading.orientation,
            ink_count: inks.length,
            phash,
            created_at: now,
            updated_at: now,
            published_at: published ? now : null,
            hold: duplicateOf === null ? null : "duplicate",
            duplicate_of: duplicateOf,
            display_key: own?.displayKey ?? null,
            thumb_key: own?.thumbKey ?? null,
            placeholder: own?.placeholder ?? null,
            width: own?.width ?? null,
            height: own?.height ?? null,
            outline_json: own ? JSON.stringify(own.outline) : outline ? JSON.stringify(outline) : null,
          });
          await repo.replaceInks(tx, id, input.inks);
          await repo.replaceBands(tx, id, tagBands(reading.bands, inks));
          return { id, status: published ? ("published" as const) : ("pending" as const) };
        });
      } catch (err) {
        if (own) await removeOwnImages(own);
        throw err;
      }
    },

    async get(id: number, viewer: Me | null): Promise<Strip> {
      const row = await getRow(id, viewer);
      return (await hydrate(db, [row]))[0]!;
    },

    /** The gallery and every search: published strips only, by inks, colours, brand, type, paper… */
    search(q: StripSearchQuery, viewer: Me | null = null) {
      return searchStripList(db, q, hydrate, viewer?.id ?? null);
    },

    async related(id: number, viewer: Me | null, limit = 6): Promise<Strip[]> {
      await getRow(id, viewer);
      const ids = (await repo.relatedStripIds(db, id, limit)).map((r) => r.strip_id);
      if (!ids.length) return [];
      const rows = await db.selectFrom("strips").selectAll().where("id", "in", ids).execute();
      const strips = await hydrate(db, rows);
      return ids.map((sid) => strips.find((s) => s.id === sid)!).filter(Boolean);
    },

    async edit(id: number, me: Me, patch: StripPatch) {
      assertCanContribute(me);
      const notes = patch.notes !== undefined ? cleanNotes(patch.notes) : undefined;
      return db.transaction().execute(async (tx) => {
        const row = await authorRow(id, me, tx);
        if (patch.expectedVersion !== undefined && patch.expectedVersion !== row.version) {
          throw new AppError("stale_version", "This strip changed since you opened it. Reload to see the latest version.", 409);
        }
        if (row.status === "hidden" || row.status === "rejected") {
          throw new AppError("locked", "A moderator has taken this strip down, so it cannot be edited. You can delete it.", 409);
        }
        // A non-trusted author's edit goes (back) to review; a returned strip is resubmitted.
        const status: StripRow["status"] =
          row.status === "returned" || (row.status === "published" && me.standing !== "trusted") ? "pending" : row.status;
        const now = nowIso();
        await repo.updateStrip(tx, id, {
          ...(patch.title !== undefined && { title: patch.title }),
          ...(notes !== undefined && { notes_html: notes }),
          ...(patch.paper !== undefined && { paper: patch.paper }),
          ...(patch.tools !== undefined && { tools_json: JSON.stringify(patch.tools) }),
          ...(patch.videoUrl !== undefined && { video_url: patch.videoUrl || null }),
          ...(patch.inks !== undefined && { ink_count: patch.inks.length }),
          status,
          status_reason: status === row.status ? row.status_reason : null,
          version: row.version + 1,
          updated_at: now,
        });
        if (patch.inks) {
          const inks = await checkedInks(tx, patch.inks);
          await repo.replaceInks(tx, id, patch.inks);
          const upload = await tx.selectFrom("uploads").select("analysis_json").where("id", "=", row.upload_id).executeTakeFirst();
          if (upload?.analysis_json) await repo.replaceBands(tx, id, tagBands(bandsOf(JSON.parse(upload.analysis_json), row.strip_index), inks));
        }
        const updated = await repo.findStrip(tx, id);
        return (await hydrate(tx, [updated!]))[0]!;
      });
    },

    /**
     * Deletes the strip and its own images. Its photo (upload, original, display files) goes too
     * once nothing needs it: no other strip posted from it, and no strip of it still waiting to be
     * posted as a draft (a several-strip photo within the draft week).
     */
    async remove(id: number, me: Me) {
      const row = await authorRow(id, me);
      const uploadGone = await db.transaction().execute(async (tx) => {
        await repo.deleteStrip(tx, id);
        const upload = await repo.findUploadOf(tx, row.upload_id);
        if (!upload) return null;
        if ((await repo.postedStripIndexes(tx, upload.id)).length > 0 || draftStillWanted(upload)) return null;
        await repo.deleteUploadRow(tx, upload.id);
        return upload;
      });
      if (row.display_key) await removeOwnImages({ displayKey: row.display_key, thumbKey: row.thumb_key });
      if (uploadGone) {
        if (uploadGone.original_key) await store.remove(uploadGone.original_key);
        await store.removeFolder(`images/${uploadGone.id}`);
      }
    },

    /** Path of an image file, if the viewer may see the strip. */
    async imagePath(id: number, variant: "display" | "thumb", viewer: Me | null) {
      const row = await getRow(id, viewer);
      let key = variant === "display" ? row.display_key : row.thumb_key;
      if (!key) {
        const upload = await repo.findUploadOf(db, row.upload_id);
        key = (variant === "display" ? upload?.display_key : upload?.thumb_key) ?? null;
      }
      if (!key) throw notFound("That image");
      return { path: store.pathOf(key), isPublic: row.status === "published" };
    },

    async memberProfile(memberId: string, viewer: Me | null): Promise<MemberProfile> {
      const profile = await db.selectFrom("profiles").selectAll().where("user_id", "=", memberId).executeTakeFirst();
      if (!profile) throw notFound("That member");
      const self = viewer?.id === memberId || isModerator(viewer);
      const rows = await repo.listStrips(db, {
        authorId: memberId,
        statuses: self ? ["pending", "published", "hidden", "returned", "rejected"] : ["published"],
        sort: "newest",
        limit: 200,
      });
      return {
        id: profile.user_id,
        name: profile.name,
        bio: profile.bio,
        standing: profile.standing,
        joinedAt: profile.created_at,
        strips: await hydrate(db, rows),
      };
    },
  };
}
export type StripsService = ReturnType<typeof createStripsService>;
