import type { z } from "zod";
import { checkRole, mustBeSignedIn, userFromRequest, type SessionUser } from "@/lib/auth/guard";
import { assertSameOrigin } from "@/lib/auth/same-origin";
import { ApiError, methodNotAllowed, toApiError, type FieldErrors } from "./errors";
import { fieldErrorsOf } from "./field-errors";
import { readJsonBody } from "./json-body";
import { parseBody } from "./parse-body";
import { parseQueryOrRefuse, queryRecord } from "./query";
import { errorResponse } from "./respond";

// The one way a route handler is made. A route file declares who may call it and what it reads,
// then calls lib and returns:
//
//   export const { GET, POST, PUT, PATCH, DELETE } = routes({
//     GET: route({ auth: "user", params: idParams("quad") }, async ({ user, params }) => privateJson(...)),
//   });
//
// route() does the rest in this order: the same-origin check for writes, the session user read
// once (401/403 by the role), path params (a bad one is a 404 naming it), the query and the
// JSON body (400 with fieldErrors); and whatever is thrown leaves as the one JSON error body.

/**
 * Who may call: "public" reads no session at all (the catalogue is public and cheap);
 * "optional" reads it and passes the user or null (a photo's visibility depends on the viewer);
 * the others need a signed-in user holding that role or a higher one.
 */
type Auth = "public" | "optional" | "user" | "moderator" | "admin";

type QueryParser = (record: Record<string, string | string[]>) => unknown;

export type RouteSpec = {
  auth: Auth;
  /** zod schema over the path's segments; an issue answers 404 with the issue's message. */
  params?: z.ZodType;
  /** an object schema (parseQuery's conventions), or a lib parser of the query record that throws its own 400. */
  query?: z.ZodObject | QueryParser;
  /** a zod schema for the JSON body, or "json" for the parsed JSON when lib validates it itself; absent: the body is not read. */
  body?: z.ZodType | "json";
  /** the JSON body's size cap in bytes; MAX_JSON_BODY_BYTES when absent. */
  maxBytes?: number;
};

/** A submission with every section full is a few kB; this is far above it and bounds the parser. */
const MAX_JSON_BODY_BYTES = 256 * 1024;

type UserOf<A extends Auth> = A extends "public" ? null : A extends "optional" ? SessionUser | null : SessionUser;
type ParamsOf<S extends RouteSpec> = S["params"] extends z.ZodType ? z.output<S["params"]> : undefined;
type QueryOf<S extends RouteSpec> = S["query"] extends z.ZodObject ? z.output<S["query"]> : S["query"] extends (record: never) => infer T ? T : undefined;
type BodyOf<S extends RouteSpec> = S["body"] extends z.ZodType ? z.output<S["body"]> : S["body"] extends "json" ? unknown : undefined;

export type RouteInput<S extends RouteSpec> = {
  req: Request;
  user: UserOf<S["auth"]>;
  params: ParamsOf<S>;
  query: QueryOf<S>;
  body: BodyOf<S>;
};

/** What Next.js passes a route handler besides the request (tests may pass nothing). */
type RouteContext = { params: Promise<Record<string, string | string[] | undefined>> } | undefined;
export type RouteHandler = ((request: Request, context?: RouteContext) => Promise<Response>) & {
  /** What the handler declared: the fuzz and authorisation-matrix tests walk it (tests/integration/route-list.ts). */
  readonly spec?: RouteSpec;
};

const NEEDS_ROLE = { moderator: ["moderator"], admin: ["admin"] } as const;

async function authorise(request: Request, auth: Auth): Promise<SessionUser | null> {
  assertSameOrigin(request);
  if (auth === "public") return null;
  const user = await userFromRequest(request);
  if (auth === "optional") return user;
  const signedIn = mustBeSignedIn(user);
  return auth === "user" ? signedIn : checkRole(signedIn, NEEDS_ROLE[auth]);
}

async function readParams(schema: z.ZodType, context: RouteContext): Promise<unknown> {
  const parsed = schema.safeParse((await context?.params) ?? {});
  if (parsed.success) return parsed.data;
  const fieldErrors: FieldErrors = fieldErrorsOf(parsed.error.issues, "path");
  throw new ApiError(404, parsed.error.issues[0].message, fieldErrors);
}

function readQuery(spec: NonNullable<RouteSpec["query"]>, request: Request): unknown {
  const record = queryRecord(request);
  if (typeof spec === "function") return spec(record);
  return parseQueryOrRefuse(spec, record);
}

async function readBody(spec: NonNullable<RouteSpec["body"]>, request: Request, maxBytes: number): Promise<unknown> {
  const json = await readJsonBody(request, maxBytes);
  return spec === "json" ? json : parseBody(spec, json);
}

/** One method of a route file: authorised, parsed, and answering errors in the one shape. */
export function route<const S extends RouteSpec>(spec: S, handle: (input: RouteInput<S>) => Promise<Response>): RouteHandler {
  const handler = async (request: Request, context?: RouteContext) => {
    try {
      const user = await authorise(request, spec.auth);
      const params = spec.params ? await readParams(spec.params, context) : undefined;
      const query = spec.query ? readQuery(spec.query, request) : undefined;
      const body = spec.body ? await readBody(spec.body, request, spec.maxBytes ?? MAX_JSON_BODY_BYTES) : undefined;
      return await handle({ req: request, user, params, query, body } as RouteInput<S>);
    } catch (error) {
      return errorResponse(toApiError(error, request));
    }
  };
  return Object.assign(handler, { spec });
}

const METHODS = ["GET", "POST", "PUT", "PATCH", "DELETE"] as const;
type Method = (typeof METHODS)[number];
// eslint-disable-next-line @typescript-eslint/no-explicit-any -- next-auth's handler takes NextRequest; any handler may be listed
type AnyHandler = (request: any, context: any) => Promise<Response>;
type Refusal = (request: Request, context?: unknown) => Promise<Response>;

/**
 * Every method of a route file: the ones given, and for the rest the JSON 405 with an Allow header
 * (RFC 9110 §15.5.6) instead of the framework's empty one. HEAD is allowed wherever GET is, as
 * Next.js answers HEAD through GET.
 */
export function routes<H extends Partial<Record<Method, AnyHandler>>>(handlers: H): { [M in Method]: M extends keyof H ? NonNullable<H[M]> : Refusal } {
  const allowed = METHODS.filter((method) => handlers[method]).flatMap((method) => (method === "GET" ? ["GET", "HEAD"] : [method]));
  const refuse: Refusal = async (request) => errorResponse(methodNotAllowed(request.method, allowed), { Allow: allowed.join(", ") });
  return Object.fromEntries(METHODS.map((method) => [method, handlers[method] ?? refuse])) as never;
}
