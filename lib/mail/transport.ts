import nodemailer, { type Transporter } from "nodemailer";
import { env } from "@/lib/env";

// One nodemailer transport per process, made from SMTP_URL (npm start and npm test point it at the
// local mail catcher; production sets a real relay). Kept on globalThis so dev reloads reuse it.
const globalForMail = globalThis as unknown as { shuntbookMail?: { url: string; transport: Transporter } };

export function smtpUrl(): string {
  const url = env().SMTP_URL;
  if (!url) throw new Error("SMTP_URL is not set: npm start and npm test run a local mail catcher and set it; see lib/env.ts");
  return url;
}

export function mailTransport(): Transporter {
  const url = smtpUrl();
  if (globalForMail.shuntbookMail?.url !== url) {
    // short timeouts: a mail job that hangs on a dead relay should fail and be retried, not sit
    globalForMail.shuntbookMail = {
      url,
      transport: nodemailer.createTransport(url, { connectionTimeout: 10_000, greetingTimeout: 10_000, socketTimeout: 20_000 }),
    };
  }
  return globalForMail.shuntbookMail.transport;
}
