import { z } from "zod";
import { plainText } from "./common";

export const roles = ["member", "moderator", "admin"] as const;
export type Role = (typeof roles)[number];
export const standings = ["new", "trusted"] as const;
export type Standing = (typeof standings)[number];

export type Me = {
  id: string;
  email: string;
  name: string;
  bio: string;
  role: Role;
  standing: Standing;
  suspendedUntil: string | null;
  hasPassword: boolean;
  createdAt: string;
};

export const profilePatch = z
  .strictObject({
    name: plainText(2, 60).optional(),
    bio: z.string().trim().max(500, "must be at most 500 characters").optional(),
  })
  .refine((v) => Object.keys(v).length > 0, { message: "nothing to change" });

export const passwordInput = z.strictObject({
  currentPassword: z.string().max(200).optional(),
  newPassword: z
    .string()
    .min(10, "needs at least 10 characters")
    .max(200, "must be at most 200 characters"),
});

export const emailSchema = z
  .string()
  .trim()
  .toLowerCase()
  .max(254)
  .email("must be an e-mail address");

/** Mail captured by the local SMTP server (development and demo only). */
export type CapturedMail = {
  id: string;
  to: string[];
  from: string;
  subject: string;
  date: string;
  text: string;
};
