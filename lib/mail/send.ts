import { z } from "zod";
import { env } from "@/lib/env";
import { mailTransport } from "./transport";

export const MailMessageSchema = z.object({
  to: z.email().max(254),
  subject: z.string().trim().min(1).max(200),
  text: z.string().min(1).max(100_000),
  html: z.string().max(200_000).optional(),
});

export type MailMessage = z.infer<typeof MailMessageSchema>;

/**
 * Sends one mail now, from MAIL_FROM. Throws when the relay refuses it, so a caller inside a job
 * (lib/jobs, "mail.send") fails the job and pg-boss retries it later. Code that must not lose a
 * mail when the relay is down enqueues it instead of calling this directly.
 */
export async function sendMail(msg: MailMessage): Promise<void> {
  const m = MailMessageSchema.parse(msg);
  await mailTransport().sendMail({ from: env().MAIL_FROM, to: m.to, subject: m.subject, text: m.text, html: m.html });
}
