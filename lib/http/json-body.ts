import { badRequest } from "./errors";

/**
 * A request's JSON body, for every mutating endpoint (accounts, submissions, moderation, garage).
 * It must say Content-Type: application/json: besides being honest, that makes a cross-site
 * request from a form or a plain fetch a preflighted one, which this API never grants, so another
 * site cannot post with a visitor's cookie. The size cap bounds the parser; an announced length
 * over it is refused before reading.
 */
export async function readJsonBody(request: Request, maxBytes: number): Promise<unknown> {
  const type = request.headers.get("content-type") ?? "";
  if (!/^application\/json\s*(;|$)/i.test(type)) {
    throw badRequest({ "Content-Type": ["Send the body as JSON, with Content-Type: application/json"] });
  }
  const tooLarge = () => badRequest({ body: [`The body is larger than ${maxBytes / 1024} kB`] });
  const announced = Number(request.headers.get("content-length"));
  if (Number.isFinite(announced) && announced > maxBytes) throw tooLarge();
  const text = await request.text();
  if (text.length > maxBytes) throw tooLarge();
  try {
    return JSON.parse(text);
  } catch {
    throw badRequest({ body: ["The body is not valid JSON"] });
  }
}
