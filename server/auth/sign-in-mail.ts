import type { OutgoingMail } from "../mail/mailer";

/**
 * The link in the mail opens our own confirmation page, whose button does the sign-in:
 * mail scanners that open links would otherwise use the one-time token up.
 */
export function signInMail(to: string, callbackUrl: string, appUrl: string): OutgoingMail {
  const confirm = new URL("/sign-in/confirm", appUrl);
  const cb = new URL(callbackUrl);
  confirm.searchParams.set("next", cb.pathname + cb.search);
  const link = confirm.toString();
  return {
    to,
    subject: "Your Blendwell sign-in link",
    text: [
      "Hello from Blendwell,",
      "",
      "Open this link to sign in. It works once, for the next 10 minutes:",
      link,
      "",
      "If you did not ask to sign in, you can ignore this message.",
    ].join("\n"),
    html: `<p>Hello from Blendwell,</p><p>Open this link to sign in. It works once, for the next 10 minutes:</p><p><a href="${link.replace(/&/g, "&amp;").replace(/"/g, "&quot;")}">Sign in to Blendwell</a></p><p>If you did not ask to sign in, you can ignore this message.</p>`,
  };
}
