import { notFound } from "@/lib/api/errors";
import { apiRoute, type RouteHandler } from "@/lib/api/handler";
import { role } from "@/lib/auth";
import { parseSubmissionId } from "@/lib/submissions";
import { privateJson, readJsonBody, requestUser } from "@/lib/submissions/http";
import { decide } from "./actions";
import type { Decision } from "@/lib/vocabulary";

// HTTP for the moderation and admin routes, so each route file is a line or two. Every answer is
// private (no-store): it is about people and unpublished values.

export const moderatorOnly = role("moderator");
export const adminOnly = role("admin");

export type IdContext = { params: Promise<{ id: string }> };

/** A positive int4 id from the path, else a 404 naming `id` (an id that cannot exist does not exist). */
export function parsePathId(raw: string, what: string): number {
  if (!/^[1-9][0-9]{0,9}$/.test(raw) || Number(raw) > 2_147_483_647) throw notFound(`There is no ${what} with id ${raw}.`, "id");
  return Number(raw);
}

/** POST /api/v1/moderation/submissions/{id}/<decision>: the JSON body as decide() takes it. */
export function decisionRoute(decision: Decision): RouteHandler<IdContext> {
  return apiRoute<IdContext>(
    async (request, { params }) => {
      const actor = await requestUser(request);
      const id = parseSubmissionId((await params).id);
      return privateJson(await decide(actor, id, decision, await readJsonBody(request)));
    },
    { guard: moderatorOnly },
  );
}

export { privateJson, readJsonBody, requestUser };
