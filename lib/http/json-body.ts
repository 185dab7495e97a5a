import { badRequest } from "./errors";
import { readBodyText } from "./body-stream";
import { MAX_JSON_DEPTH, nestsDeeperThan } from "./json-depth";

/**
 * A request's JSON body, for every mutating endpoint (accounts, submissions, moderation, garage).
 * It must say Content-Type: application/json: besides being honest, that makes a cross-site
 * request from a form or a plain fetch a preflighted one, which this API never grants, so another
 * site cannot post with a visitor's cookie. The body is read as it streams and refused with 413
 * past `maxBytes` (lib/http/body-stream.ts); one nested past MAX_JSON_DEPTH is refused with 400
 * before it is parsed, so nothing after this ever walks a body deep enough to exhaust the stack.
 */
export async function readJsonBody(request: Request, maxBytes: number): Promise<unknown> {
  const type = request.headers.get("content-type") ?? "";
  if (!/^application\/json\s*(;|$)/i.test(type)) {
    throw badRequest({ "Content-Type": ["Send the body as JSON, with Content-Type: application/json"] });
  }
  const text = await readBodyText(request, maxBytes);
  if (nestsDeeperThan(text, MAX_JSON_DEPTH)) {
    throw badRequest({ body: [`The JSON nests arrays and objects more than ${MAX_JSON_DEPTH} levels deep; no body here needs that many.`] });
  }
  try {
    return JSON.parse(text);
  } catch {
    throw badRequest({ body: ["The body is not valid JSON"] });
  }
}
