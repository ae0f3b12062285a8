import { z } from "zod";
import { idParam } from "./common";
import type { Strip, StripStatus } from "./strips";

export const decisionActions = ["approve", "return", "hide", "reject", "restore"] as const;
export type DecisionAction = (typeof decisionActions)[number];

/** Our own reason lists, one per action; "other" needs a note. */
export const decisionReasons: Record<DecisionAction, readonly string[]> = {
  approve: ["looks good", "inks confirmed", "duplicate checked: it is a different strip", "reports checked: nothing wrong", "other"],
  return: ["inks need naming or correcting", "photo too dark or off-colour", "strip not fully in frame", "ink still wet in the photo", "title or notes need work", "other"],
  hide: ["not a blended strip", "someone else's photo", "spam or advertising", "offensive", "duplicate of another strip", "other"],
  reject: ["not a blended strip", "someone else's photo", "spam or advertising", "offensive", "duplicate of another strip", "other"],
  restore: ["hidden by mistake", "author fixed the problem", "reports were unfounded", "other"],
};

export const actionLabels: Record<DecisionAction, string> = {
  approve: "Approve",
  return: "Return for edits",
  hide: "Hide",
  reject: "Reject",
  restore: "Restore",
};

/** Which statuses each action may start from. */
export const actionFrom: Record<DecisionAction, readonly StripStatus[]> = {
  approve: ["pending", "hidden"],
  return: ["pending", "published"],
  hide: ["pending", "published"],
  reject: ["pending"],
  restore: ["hidden", "rejected"],
};

const note = z.string().trim().max(1000, "must be at most 1000 characters").default("");

export const decisionInput = z
  .strictObject({
    action: z.enum(decisionActions, { error: "must be approve, return, hide, reject or restore" }),
    reason: z.string().trim().min(1, "choose a reason").max(100),
    note,
    expectedVersion: z.number({ error: "is required" }).int().positive(),
  })
  .superRefine((v, ctx) => {
    if (!decisionReasons[v.action].includes(v.reason)) {
      ctx.addIssue({ code: "custom", path: ["reason"], message: `is not a reason for ${v.action}` });
    }
    if (v.reason === "other" && !v.note) ctx.addIssue({ code: "custom", path: ["note"], message: "say why, when the reason is \"other\"" });
  });
export type DecisionInput = z.input<typeof decisionInput>;

export const bulkDecisionInput = z.strictObject({
  action: z.enum(["approve", "hide"]),
  reason: z.string().trim().min(1).max(100),
  note,
  items: z
    .array(z.strictObject({ id: idParam, expectedVersion: z.number().int().positive() }))
    .min(1, "choose at least one strip")
    .max(50, "at most 50 at once"),
});

export const reportReasons = ["not a blended strip", "wrong inks", "spam or advertising", "someone else's photo", "offensive", "other"] as const;
export const reportInput = z
  .strictObject({ reason: z.enum(reportReasons, { error: "choose a reason from the list" }), note })
  .refine((v) => v.reason !== "other" || !!v.note, { path: ["note"], message: "say what is wrong" });

export const inkCorrectionInput = z.strictObject({
  inks: z.array(idParam).min(1).max(8).refine((ids) => new Set(ids).size === ids.length, "an ink is listed twice"),
  note,
  expectedVersion: z.number().int().positive(),
});

export const standingInput = z.strictObject({ standing: z.enum(["new", "trusted"]), reason: z.string().trim().min(3).max(300) });
export const suspensionInput = z.strictObject({
  /** Days from now; 0 lifts a suspension. */
  days: z.number().int().min(0).max(3650),
  reason: z.string().trim().min(3, "say why").max(300),
});
export const roleInput = z.strictObject({ role: z.enum(["member", "moderator", "admin"]), reason: z.string().trim().min(3).max(300) });

export const moderationLogQuery = z.strictObject({
  strip: idParam.optional(),
  member: z.string().uuid().optional(),
  moderator: z.string().uuid().optional(),
  action: z.string().max(30).optional(),
  before: idParam.optional(),
  limit: z.coerce.number().int().min(1).max(100).default(50),
});

export type QueueReason = "new member" | "edited, back to review" | "possible duplicate" | "held: reports" | "reported";

export type ReviewQueueItem = {
  strip: Strip;
  reasons: QueueReason[];
  waitingSince: string;
  author: { id: string; name: string; standing: "new" | "trusted"; approved: number; hidden: number };
  reports: { reason: string; note: string; createdAt: string }[];
  duplicates: { id: number; title: string; status: StripStatus }[];
  /** Bands whose tagged ink is far from the measured colour (ΔE2000 > 8). */
  farBands: number[];
  suggestions: { bandIndex: number; inks: { inkId: number; name: string; brand: string; deltaE: number }[] }[];
};

export type ModerationLogEntry = {
  id: number;
  moderator: { id: string; name: string };
  action: string;
  strip: { id: number; title: string } | null;
  member: { id: string; name: string } | null;
  reason: string;
  note: string;
  before: string | null;
  after: string | null;
  createdAt: string;
};

export type Notice = { id: number; kind: string; stripId: number | null; title: string; body: string; createdAt: string; readAt: string | null };
