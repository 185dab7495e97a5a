import { QueryTypes } from "sequelize";
import { z } from "zod";
import { ApiError, badRequest } from "@/lib/http/errors";
import { pageParam, parseQueryOrRefuse } from "@/lib/http/query";
import { whereOf } from "@/lib/db/where";
import { db } from "@/models";
import { type Role, ROLES } from "@/lib/vocabulary";
import { writeAuditEvent, type AuditEventView, type UserState, getAuditEvent } from "./audit";
import { fieldErrorsOf } from "@/lib/http/field-errors";
import { UserPatchBodySchema } from "./schemas";
import { decideTrust, trustThreshold, type TrustState } from "./trust";
import type { Actor } from "./actions";

// Admins change people's roles and trust here, each change one audited transaction. A role change
// applies on the person's very next request (the guard re-reads the role, lib/auth/guard.ts). The
// last admin cannot be demoted, so the site always keeps someone who can undo mistakes.

export type UserSummary = {
  id: string;
  name: string;
  email: string;
  role: Role;
  createdAt: string;
  trust: TrustState;
  record: { pending: number; approved: number; rejected: number; changesRequested: number };
};

type UserRow = {
  id: string;
  name: string;
  email: string;
  role: Role;
  trusted: boolean | null;
  createdAt: Date;
  pending: number;
  approved: number;
  rejected: number;
  changesRequested: number;
};

// each person's counts come from submissions_contributor_status_created_idx
const USER_SELECT = `
  SELECT u.id, u.name, u.email, u.role, u.trusted, u.created_at AS "createdAt", c.pending, c.approved, c.rejected, c."changesRequested"
    FROM users u
    CROSS JOIN LATERAL (
      SELECT count(*) FILTER (WHERE s.status = 'pending')::int AS pending,
             count(*) FILTER (WHERE s.status = 'approved')::int AS approved,
             count(*) FILTER (WHERE s.status = 'rejected')::int AS rejected,
             count(*) FILTER (WHERE s.status = 'changes_requested')::int AS "changesRequested"
        FROM submissions s WHERE s.contributor_id = u.id) c`;

function toSummary(r: UserRow, threshold: number): UserSummary {
  return {
    id: r.id,
    name: r.name,
    email: r.email,
    role: r.role,
    createdAt: new Date(r.createdAt).toISOString(),
    trust: decideTrust(r, r.trusted, threshold),
    record: { pending: r.pending, approved: r.approved, rejected: r.rejected, changesRequested: r.changesRequested },
  };
}

export async function getUserSummary(id: string): Promise<UserSummary | null> {
  if (!z.uuid().safeParse(id).success) return null;
  const [row] = await db().query<UserRow>(`${USER_SELECT} WHERE u.id = :id`, { replacements: { id }, type: QueryTypes.SELECT });
  return row ? toSummary(row, trustThreshold()) : null;
}

const USERS_PAGE_SIZE = 20;
const SEARCH_MAX_LENGTH = 100;

const UsersQuerySchema = z.object({
  page: pageParam(),
  role: z.enum(ROLES, { error: `role is one of: ${ROLES.join(", ")}` }).optional(),
  /** Any part of a name or e-mail address, case-insensitive; empty means everyone. */
  q: z
    .string()
    .trim()
    .max(SEARCH_MAX_LENGTH, `q (the search) is at most ${SEARCH_MAX_LENGTH} characters`)
    .optional()
    .transform((v) => v || undefined),
});
export type UsersQuery = z.output<typeof UsersQuerySchema>;

export function parseUsersQuery(input: Record<string, string | string[] | undefined>): UsersQuery {
  return parseQueryOrRefuse(UsersQuerySchema, input);
}

export type UsersPage = { users: UserSummary[]; page: number; pageSize: number; total: number; pageCount: number; q: string | null };

/** "50%_off\\" as an ILIKE pattern that finds exactly that text anywhere: its wildcards and the escape taken literally. */
const containsPattern = (text: string) => `%${text.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;

/**
 * People for the admin's list: admins, then moderators, then contributors; by name; paged. The
 * role filter is served by users_role_idx, the search (any part of name or e-mail) by
 * users_name_email_trgm_idx over the same expression.
 */
export async function listUsers(query: Partial<UsersQuery> = {}): Promise<UsersPage> {
  const q = UsersQuerySchema.parse(query);
  const replacements: Record<string, unknown> = { limit: USERS_PAGE_SIZE, offset: (q.page - 1) * USERS_PAGE_SIZE };
  const where = whereOf(
    [
      ["u.role = :role", "role", q.role],
      ["(u.name || ' ' || u.email) ILIKE :like", "like", q.q === undefined ? undefined : containsPattern(q.q)],
    ],
    replacements,
  );
  const sequelize = db();
  const [rows, [{ total }]] = await Promise.all([
    sequelize.query<UserRow>(
      `${USER_SELECT} ${where} ORDER BY array_position(ARRAY['admin', 'moderator', 'contributor'], u.role), lower(u.name), u.id LIMIT :limit OFFSET :offset`,
      { replacements, type: QueryTypes.SELECT },
    ),
    sequelize.query<{ total: number }>(`SELECT count(*)::int AS total FROM users u ${where}`, { replacements, type: QueryTypes.SELECT }),
  ]);
  const threshold = trustThreshold();
  return {
    users: rows.map((r) => toSummary(r, threshold)),
    page: q.page,
    pageSize: USERS_PAGE_SIZE,
    total,
    pageCount: Math.max(1, Math.ceil(total / USERS_PAGE_SIZE)),
    q: q.q ?? null,
  };
}

export type UserUpdateResult = { user: UserSummary; event: AuditEventView | null };

const missingUser = (id: string) => new ApiError(404, `There is no user with id ${id}.`, { id: [`There is no user with id ${id}.`] });

/**
 * Changes a user's role and/or trust: body { role?, trusted?, reason? } (trusted: true, false, or
 * null for "by their record"). One audit event 'user_update' with the fields that changed; a
 * request that changes nothing writes nothing and returns event null. 409 when it would leave no admin.
 */
export async function updateUser(actor: Actor, userId: string, body: unknown): Promise<UserUpdateResult> {
  if (!z.uuid().safeParse(userId).success) throw missingUser(userId);
  const parsed = UserPatchBodySchema.safeParse(body ?? {});
  if (!parsed.success) throw badRequest(fieldErrorsOf(parsed.error.issues));
  const change = parsed.data;
  const sequelize = db();
  const eventId = await sequelize.transaction(async (transaction) => {
    // a role change first locks every admin row, in id order, then the person: two admins demoting
    // each other at once queue up instead of both passing the "another admin remains" check
    const admins =
      change.role !== undefined
        ? await sequelize.query<{ id: string }>("SELECT id FROM users WHERE role = 'admin' ORDER BY id FOR UPDATE", { type: QueryTypes.SELECT, transaction })
        : [];
    const [current] = await sequelize.query<{ role: Role; trusted: boolean | null }>("SELECT role, trusted FROM users WHERE id = :id FOR UPDATE", {
      replacements: { id: userId },
      type: QueryTypes.SELECT,
      transaction,
    });
    if (!current) throw missingUser(userId);
    const before: UserState = {};
    const after: UserState = {};
    if (change.role !== undefined && change.role !== current.role) {
      if (current.role === "admin" && admins.filter((a) => a.id !== userId).length === 0) {
        throw new ApiError(409, "This is the only admin; make someone else an admin first.", { role: ["the site needs at least one admin"] });
      }
      before.role = current.role;
      after.role = change.role;
    }
    if (change.trusted !== undefined && change.trusted !== current.trusted) {
      before.trusted = current.trusted;
      after.trusted = change.trusted;
    }
    if (Object.keys(after).length === 0) return null;
    await sequelize.query("UPDATE users SET role = :role, trusted = :trusted, updated_at = now() WHERE id = :id", {
      replacements: { id: userId, role: after.role ?? current.role, trusted: "trusted" in after ? after.trusted : current.trusted },
      transaction,
    });
    const event = await writeAuditEvent(
      { entityType: "user", targetUserId: userId, actorId: actor.id, action: "user_update", reason: change.reason ?? null, before, after },
      transaction,
    );
    return event.id;
  });
  const user = (await getUserSummary(userId))!;
  return { user, event: eventId === null ? null : await getAuditEvent(eventId) };
}
