import nodemailer, { type Transporter } from "nodemailer";

export type OutgoingMail = { to: string; subject: string; text: string; html?: string };

export type Mailer = {
  send(mail: OutgoingMail): Promise<void>;
  close(): void;
};

export type SmtpTarget = { url: string } | { host: string; port: number };

export function createMailer(target: SmtpTarget, from: string): Mailer {
  const transport: Transporter =
    "url" in target
      ? nodemailer.createTransport(target.url)
      : // The local SMTP server speaks plain SMTP on loopback only.
        nodemailer.createTransport({ host: target.host, port: target.port, secure: false, ignoreTLS: true });
  return {
    async send(mail) {
      const result = await transport.sendMail({ from, ...mail });
      const failed = [...(result.rejected ?? [])].filter(Boolean);
      if (failed.length) throw new Error(`Mail to ${failed.join(", ")} was refused`);
    },
    close() {
      transport.close();
    },
  };
}
