import { env } from "@/lib/env";

/** An absolute address on this site, for links in mails (NEXTAUTH_URL is the public base URL). */
export function siteUrl(path: string): string {
  const base = env().NEXTAUTH_URL ?? `http://127.0.0.1:${env().PORT}`;
  return new URL(path, base).toString();
}
