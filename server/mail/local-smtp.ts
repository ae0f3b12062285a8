import { randomUUID } from "node:crypto";
import { mkdirSync, promises as fs } from "node:fs";
import type { AddressInfo } from "node:net";
import path from "node:path";
import { simpleParser } from "mailparser";
import { SMTPServer } from "smtp-server";
import type { CapturedMail } from "../../shared/schemas/accounts";

/**
 * A real SMTP server on loopback that stands in for the hosted mail service in development,
 * demo and tests. Every message it receives is kept as JSON under DATA_DIR/mail.
 */
export type LocalSmtp = { host: string; port: number; mailDir: string; close(): Promise<void> };

export function mailDirOf(dataDir: string) {
  return path.join(dataDir, "mail");
}

export async function startLocalSmtp(dataDir: string, port = 0): Promise<LocalSmtp> {
  const mailDir = mailDirOf(dataDir);
  mkdirSync(mailDir, { recursive: true });
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ["STARTTLS", "AUTH"],
    size: 5 * 1024 * 1024,
    logger: false,
    onData(stream, _session, callback) {
      simpleParser(stream)
        .then(async (parsed) => {
          const to = [parsed.to].flat().flatMap((a) => a?.value.map((v) => v.address ?? "") ?? []);
          const date = new Date().toISOString();
          const mail: CapturedMail = {
            id: `${date.replace(/[:.]/g, "-")}-${randomUUID().slice(0, 8)}`,
            to,
            from: parsed.from?.text ?? "",
            subject: parsed.subject ?? "",
            date,
            text: parsed.text ?? "",
          };
          await fs.writeFile(path.join(mailDir, `${mail.id}.json`), JSON.stringify(mail, null, 2));
          callback();
        })
        .catch((err: Error) => callback(err));
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once("error", reject);
    server.listen(port, "127.0.0.1", () => resolve());
  });
  const address = server.server.address() as AddressInfo;
  return {
    host: "127.0.0.1",
    port: address.port,
    mailDir,
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}

/** Captured mail, newest first. */
export async function readCapturedMail(dataDir: string): Promise<CapturedMail[]> {
  const dir = mailDirOf(dataDir);
  let names: string[];
  try {
    names = await fs.readdir(dir);
  } catch {
    return [];
  }
  const mails = await Promise.all(
    names
      .filter((n) => n.endsWith(".json"))
      .map(async (n) => JSON.parse(await fs.readFile(path.join(dir, n), "utf8")) as CapturedMail),
  );
  return mails.sort((a, b) => (a.date < b.date ? 1 : a.date > b.date ? -1 : b.id.localeCompare(a.id)));
}
