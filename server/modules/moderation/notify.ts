import { nowIso, type DbOrTx } from "../../db/client";
import { enqueueMail } from "../../mail/outbox";

/** Tells a member something in the app and by e-mail (sent later by the outbox). */
export async function notify(
  db: DbOrTx,
  to: { userId: string },
  notice: { kind: string; stripId: number | null; title: string; body: string },
  appUrl: string,
) {
  await db
    .insertInto("notices")
    .values({ user_id: to.userId, kind: notice.kind, strip_id: notice.stripId, title: notice.title, body: notice.body, created_at: nowIso() })
    .execute();
  const user = await db.selectFrom("User").select("email").where("id", "=", to.userId).executeTakeFirst();
  if (!user) return;
  const link = notice.stripId ? `\n\nSee it here: ${appUrl}/strips/${notice.stripId}` : "";
  await enqueueMail(db, { to: user.email, subject: `Blendwell: ${notice.title}`, text: `${notice.body}${link}\n\n— the Blendwell moderators` });
}
