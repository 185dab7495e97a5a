import type { Role } from "@/lib/vocabulary";
import { DEMO_ACCOUNT_LIST } from "./accounts";
import { createRng } from "./random";
import { monthsBefore } from "./timeline";

export type DemoUser = {
  id: string;
  name: string;
  email: string;
  role: Role;
  emailVerified: Date | null;
  /** plain text, only for the demo sign-in accounts; the seeder stores a bcrypt hash of it */
  password: string | null;
  createdAt: Date;
};

/** Reserved for examples (RFC 2606), so no invented address can reach a real mailbox. */
const DEMO_PEOPLE_EMAIL_DOMAIN = "pilots.example";
const DEMO_PEOPLE_COUNT = 25;

/** Roles of the invented people, in order: mostly contributors, two moderators, one admin. */
function roleOf(index: number): Role {
  if (index === 0) return "admin";
  if (index === 1 || index === 2) return "moderator";
  return "contributor";
}

const emailPart = (s: string) =>
  s
    .normalize("NFKD")
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, "");

/** The invented community (faker, fixed seed) followed by the three demo sign-in accounts. */
export function buildDemoPeople(anchor: Date, seed: number): DemoUser[] {
  const rng = createRng(seed);
  const seen = new Set<string>();
  const people: DemoUser[] = [];
  for (let i = 0; i < DEMO_PEOPLE_COUNT; i++) {
    const firstName = rng.faker.person.firstName();
    const lastName = rng.faker.person.lastName();
    let local = `${emailPart(firstName)}.${emailPart(lastName)}`;
    for (let n = 2; seen.has(local); n++) local = `${emailPart(firstName)}.${emailPart(lastName)}${n}`;
    seen.add(local);
    const createdAt = monthsBefore(anchor, 19 + rng.uniform() * 5);
    people.push({
      id: rng.faker.string.uuid(),
      name: `${firstName} ${lastName}`,
      email: `${local}@${DEMO_PEOPLE_EMAIL_DOMAIN}`,
      role: roleOf(i),
      // a few never confirmed their address
      emailVerified: rng.chance(0.85) ? new Date(createdAt.getTime() + 3_600_000) : null,
      password: null,
      createdAt,
    });
  }
  for (const account of DEMO_ACCOUNT_LIST) {
    const createdAt = monthsBefore(anchor, 19);
    people.push({
      id: rng.faker.string.uuid(),
      name: account.name,
      email: account.email,
      role: account.role,
      emailVerified: createdAt,
      password: account.password,
      createdAt,
    });
  }
  return people;
}
