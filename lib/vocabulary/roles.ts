// Who someone is on the site. Ranked lowest first; lib/auth/roles.ts holds what the rank allows.
export const ROLES = ["contributor", "moderator", "admin"] as const;
export type Role = (typeof ROLES)[number];

/** The roles an admin can give, lowest first: every role. */
export const ROLE_CHOICES = ROLES;

export const ROLE_LABELS: Record<Role, string> = { contributor: "Contributor", moderator: "Moderator", admin: "Admin" };
