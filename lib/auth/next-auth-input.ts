import { NextRequest } from "next/server";
import { readBodyText } from "@/lib/http/body-stream";
import { ApiError, badRequest } from "@/lib/http/errors";
import { hasLineControl } from "@/lib/input/text";
import { ACCOUNT_BODY_BYTES } from "./schemas";
import { siteUrl } from "./site-url";

// What reaches next-auth's own endpoints is checked here first, since next-auth answers odd input
// with a 500 (a JSON body that does not parse, a callbackUrl that is not a URL) or acts on part of
// it (a field sent twice: next-auth takes the last, a limiter reading the first would count
// another account). Every refusal is a 400 naming the field (a body past the cap a 413), in the
// API's error shape.
// next-auth's browser side and ours (components/auth/next-auth-client.ts) post HTML-form bodies
// only, so that is the one body type accepted.

const FORM_TYPE = /^application\/x-www-form-urlencoded\s*(;|$)/i;
const MAX_FIELD_CHARS = 2000;

export type CheckedAuthRequest = { request: NextRequest; form: URLSearchParams | null };

/** A path on this site, or an absolute URL on this site's origin; nothing else is a place to return to. */
export function isOwnCallbackUrl(value: string): boolean {
  if (value.startsWith("/")) return !value.startsWith("//") && !value.startsWith("/\\");
  if (!URL.canParse(value)) return false;
  return new URL(value).origin === new URL(siteUrl("/")).origin;
}

function checkFields(params: URLSearchParams, where: string): void {
  const seen = new Set<string>();
  for (const [name, value] of params) {
    const field = name.slice(0, 60);
    if (seen.has(name)) throw badRequest({ [field]: [`${field} is given twice in the ${where}; send it once.`] });
    seen.add(name);
    if (hasLineControl(value)) throw badRequest({ [field]: ["Leave out control characters (such as NUL or line breaks)."] });
    if (value.length > MAX_FIELD_CHARS) throw badRequest({ [field]: [`Use at most ${MAX_FIELD_CHARS} characters.`] });
    if (name === "callbackUrl" && !isOwnCallbackUrl(value)) throw badRequest({ callbackUrl: ["Give a page on this site to come back to."] });
  }
}

async function readForm(request: NextRequest): Promise<string> {
  if (!FORM_TYPE.test(request.headers.get("content-type") ?? "")) {
    throw badRequest({ "Content-Type": ["Send the fields as an HTML form, with Content-Type: application/x-www-form-urlencoded"] });
  }
  return readBodyText(request, ACCOUNT_BODY_BYTES); // 413 past the cap, read no further
}

/**
 * The request to hand next-auth (its body re-made from the text read here) and its form fields,
 * or ApiError(400) naming the field that is refused.
 */
export async function checkNextAuthRequest(request: NextRequest): Promise<CheckedAuthRequest> {
  checkFields(request.nextUrl.searchParams, "address");
  if (request.method !== "POST") return { request, form: null };
  const text = await readForm(request);
  let form: URLSearchParams;
  try {
    form = new URLSearchParams(text);
  } catch {
    throw new ApiError(400, "The form could not be read.", { body: ["The form could not be read."] });
  }
  checkFields(form, "form");
  return { request: new NextRequest(request.url, { method: "POST", headers: request.headers, body: text }), form };
}
