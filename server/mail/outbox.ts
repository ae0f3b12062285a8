import type { Logger } from "pino";
import { nowIso, type Db, type DbOrTx } from "../db/client";
import type { Mailer } from "./mailer";

const MAX_ATTEMPTS = 8;

/** Queues a message in the same transaction as the action it tells about. */
export async function enqueueMail(db: DbOrTx, mail: { to: string; subject: string; text: string }) {
  const now = nowIso();
  await db
    .insertInto("mail_outbox")
    .values({ to_address: mail.to, subject: mail.subject, text: mail.text, next_attempt_at: now, created_at: now })
    .execute();
}

/** Sends queued mail; failures are retried with growing waits (1, 2, 4 … minutes). */
export function createOutbox(deps: { db: Db; mailer: Mailer; logger: Logger }) {
  const { db, mailer, logger } = deps;
  let timer: NodeJS.Timeout | null = null;
  let flushing: Promise<number> | null = null;

  async function sendDue(): Promise<number> {
    const due = await db
      .selectFrom("mail_outbox")
      .selectAll()
      .where("sent_at", "is", null)
      .where("attempts", "<", MAX_ATTEMPTS)
      .where("next_attempt_at", "<=", nowIso())
      .orderBy("id")
      .limit(50)
      .execute();
    let sent = 0;
    for (const mail of due) {
      try {
        await mailer.send({ to: mail.to_address, subject: mail.subject, text: mail.text });
        await db.updateTable("mail_outbox").set({ sent_at: nowIso(), attempts: mail.attempts + 1, last_error: null }).where("id", "=", mail.id).execute();
        sent++;
      } catch (err) {
        const wait = 60_000 * 2 ** mail.attempts;
        await db
          .updateTable("mail_outbox")
          .set({ attempts: mail.attempts + 1, last_error: String((err as Error).message ?? err).slice(0, 500), next_attempt_at: new Date(Date.now() + wait).toISOString() })
          .where("id", "=", mail.id)
          .execute();
        logger.warn({ err, mailId: mail.id }, "mail not sent; will retry");
      }
    }
    return sent;
  }

  return {
    /** Sends what is due now (one run at a time). */
    flush(): Promise<number> {
      flushing ??= sendDue().finally(() => (flushing = null));
      return flushing;
    },
    start(intervalMs = 5_000) {
      timer = setInterval(() => void this.flush().catch((err) => logger.error({ err }, "outbox failed")), intervalMs);
      timer.unref();
    },
    async stop() {
      if (timer) clearInterval(timer);
      await flushing;
    },
  };
}
export type Outbox = ReturnType<typeof createOutbox>;
