import type { Role } from "@/lib/vocabulary";

// Roles are ranked: contributor < moderator < admin. A check for a role lets in that role and
// every higher one, so an admin passes every check a moderator passes, and a moderator can still
// contribute. Who owns a row (a contributor editing their own submission) is a separate check.
const RANK: Record<Role, number> = { contributor: 0, moderator: 1, admin: 2 };

/** Whether someone with `role` passes a check that names `allowed` (any one of them). */
export function roleSatisfies(role: Role, allowed: readonly Role[]): boolean {
  if (allowed.length === 0) return true;
  return allowed.some((needed) => RANK[role] >= RANK[needed]);
}
