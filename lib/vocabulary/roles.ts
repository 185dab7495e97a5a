// Who someone is on the site, and the roles an admin can give. Ranked lowest first; lib/auth/roles.ts holds what the rank allows.
export const ROLES = ["contributor", "moderator", "admin"] as const;
export type Role = (typeof ROLES)[number];

export const ROLE_LABELS: Record<Role, string> = { contributor: "Contributor", moderator: "Moderator", admin: "Admin" };
