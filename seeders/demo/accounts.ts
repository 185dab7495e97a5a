import type { Role } from "@/models/User";

// Demo sign-in accounts, one per role, with known passwords so that the README, the browser tests
// and a reviewer can sign in to a freshly seeded database. The seeder stores them hashed (bcrypt,
// cost 10); only the demo scenario ever contains these plain texts.
export type DemoAccount = { role: Role; name: string; email: string; password: string };

export const DEMO_ACCOUNTS = {
  contributor: { role: "contributor", name: "Demo Contributor", email: "contributor@shuntbook.test", password: "demo-contributor-pass" },
  moderator: { role: "moderator", name: "Demo Moderator", email: "moderator@shuntbook.test", password: "demo-moderator-pass" },
  admin: { role: "admin", name: "Demo Admin", email: "admin@shuntbook.test", password: "demo-admin-pass" },
} as const satisfies Record<Role, DemoAccount>;

export const DEMO_ACCOUNT_LIST: readonly DemoAccount[] = Object.values(DEMO_ACCOUNTS);

/** bcrypt cost factor for the demo passwords (the bcryptjs default). */
export const DEMO_BCRYPT_COST = 10;
