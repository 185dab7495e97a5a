import Link from "next/link";
import { unstable_rethrow } from "next/navigation";
import { currentUser, type SessionUser } from "@/lib/auth/guard";
import { NavLink } from "@/components/nav-link";

// The header's account corner: "Sign in" for visitors, the person's name (to the profile) and
// "Sign out" once signed in. The user comes from the guard, so a role or name change shows at once.

async function signedInUser(): Promise<SessionUser | null> {
  try {
    return await currentUser();
  } catch (error) {
    unstable_rethrow(error); // Next's own signals (dynamic rendering, redirects) must pass through
    // the header must not take a page down with it (e.g. the database is briefly unreachable)
    console.error("[auth] header could not read the session:", error);
    return null;
  }
}

export async function AccountLinks() {
  const user = await signedInUser();
  if (!user) {
    return (
      <li>
        <NavLink href="/signin">Sign in</NavLink>
      </li>
    );
  }
  return (
    <>
      <li>
        <NavLink href="/profile">
          <span className="sr-only">Your profile: </span>
          <span className="inline-block max-w-[12ch] truncate align-bottom normal-case">{user.name}</span>
        </NavLink>
      </li>
      <li>
        <Link
          href="/signout"
          className="inline-flex min-h-11 items-center border-b-4 border-transparent px-1 font-display text-lg font-bold uppercase tracking-wider text-ink no-underline hover:border-copper hover:text-ink"
        >
          Sign out
        </Link>
      </li>
    </>
  );
}
