import bcrypt from "bcryptjs";

// bcrypt cost 12: about a quarter of a second here, the usual balance for interactive sign-in.
const COST = 12;

export const hashPassword = (plain: string) => bcrypt.hash(plain, COST);
export const verifyPassword = (plain: string, hash: string) => bcrypt.compare(plain, hash);

/** Compared against when the e-mail is unknown, so both paths take the same time. */
export const DUMMY_HASH = bcrypt.hashSync("not-a-real-password", COST);
