// Why a visitor was sent to the sign-in page, from the page they were on their way to: a page
// that needs an account says so instead of leaving them to guess.
const REASONS: ReadonlyArray<[prefix: string, reason: string]> = [
  ["/garage", "Your garage keeps your own quads, packs and worksheets: sign in to open it."],
  ["/submit", "Sending the values you measured needs an account, so that moderators can ask you about them."],
  ["/my", "Your submissions are listed for you alone: sign in to see them."],
  ["/moderation", "The review queue is for moderators: sign in with a moderator's account."],
  ["/admin", "The admin pages are for administrators: sign in with an administrator's account."],
  ["/profile", "Sign in to see and change your profile."],
];

/** The sentence for a sign-in page opened on the way to `next`, or null for no particular reason. */
export function signInReason(next: string): string | null {
  const path = next.split(/[?#]/)[0];
  return REASONS.find(([prefix]) => path === prefix || path.startsWith(`${prefix}/`))?.[1] ?? null;
}
