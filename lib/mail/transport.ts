import nodemailer, { type Transporter } from "nodemailer";
import { env } from "@/lib/env";

// One pooled nodemailer transport per process, made from SMTP_URL (npm start and npm test point it
// at the local mail catcher; production sets a real relay). Kept on globalThis so dev reloads
// reuse it. Pooled: the mail worker sends several mails at once (lib/jobs, "mail.send"), each over
// an open connection instead of a new SMTP handshake per mail.

/** Open SMTP connections: as many as the mail worker sends at once (lib/jobs/handlers.ts). */
export const SMTP_CONNECTIONS = 5;

const globalForMail = globalThis as unknown as { shuntbookMail?: { url: string; transport: Transporter } };

export function smtpUrl(): string {
  const url = env().SMTP_URL;
  if (!url) throw new Error("SMTP_URL is not set: npm start and npm test run a local mail catcher and set it; see lib/env.ts");
  return url;
}

/**
 * SMTP_URL with our pool and timeout settings added as query options, which nodemailer reads
 * from a connection URL (nodemailer docs, "SMTP transport": connection URL; pooled SMTP). Options
 * already in SMTP_URL win. Short timeouts: a job that hangs on a dead relay should fail and be
 * retried, not sit.
 */
function transportUrl(url: string): string {
  const parsed = new URL(url);
  const defaults = { pool: "true", maxConnections: String(SMTP_CONNECTIONS), connectionTimeout: "10000", greetingTimeout: "10000", socketTimeout: "20000" };
  for (const [key, value] of Object.entries(defaults)) if (!parsed.searchParams.has(key)) parsed.searchParams.set(key, value);
  return parsed.toString();
}

export function mailTransport(): Transporter {
  const url = smtpUrl();
  if (globalForMail.shuntbookMail?.url !== url) {
    globalForMail.shuntbookMail?.transport.close();
    globalForMail.shuntbookMail = { url, transport: nodemailer.createTransport(transportUrl(url)) };
  }
  return globalForMail.shuntbookMail.transport;
}

/** Closes the pooled connections (tests, in afterAll). */
export function closeMailTransport(): void {
  globalForMail.shuntbookMail?.transport.close();
  globalForMail.shuntbookMail = undefined;
}
