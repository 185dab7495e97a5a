import bcrypt from "bcryptjs";

// bcrypt with cost 10: the floor the OWASP Password Storage Cheat Sheet gives for bcrypt, and the
// cost of the seeded demo hashes (seeders/demo/accounts.ts), so every hash in the table is alike.
// About 60–100 ms per hash on a small server with bcryptjs.
const BCRYPT_COST = 10;

export function hashPassword(plain: string): Promise<string> {
  return bcrypt.hash(plain, BCRYPT_COST);
}

// A hash of nothing anyone knows, compared against when there is no such user or no password, so
// that "no account" and "wrong password" take the same time and cannot be told apart.
let dummyHash: Promise<string> | undefined;

/** Whether `plain` matches `hash`; a missing hash costs the same time and answers false. */
export async function verifyPassword(plain: string, hash: string | null | undefined): Promise<boolean> {
  dummyHash ??= bcrypt.hash("no account has this password", BCRYPT_COST);
  const ok = await bcrypt.compare(plain, hash ?? (await dummyHash));
  return Boolean(hash) && ok;
}
