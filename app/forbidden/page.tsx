import type { Metadata } from "next";
import Link from "next/link";
import { AccountPage } from "@/components/auth/page-frame";
import { currentUser } from "@/lib/auth/guard";
import { type Role, ROLES } from "@/lib/vocabulary";

export const dynamic = "force-dynamic";
export const metadata: Metadata = { title: "Not for this account", robots: { index: false } };

type Props = { searchParams: Promise<{ needs?: string | string[] }> };

const ROLE_NAMES: Record<Role, string> = { contributor: "contributors", moderator: "moderators", admin: "administrators" };

// Where the guard sends a signed-in person whose role does not open a page (lib/auth/guard.ts,
// requirePageRole). Visitors who are not signed in go to /signin instead.
export default async function ForbiddenPage({ searchParams }: Props) {
  const raw = (await searchParams).needs;
  const needs = String(Array.isArray(raw) ? raw[0] : (raw ?? ""))
    .split(",")
    .filter((r): r is Role => (ROLES as readonly string[]).includes(r));
  const user = await currentUser();
  return (
    <AccountPage kicker="403" title="Not open to this account">
      <div className="max-w-prose space-y-4 text-lead">
        <p>
          {needs.length ? `That page is for ${needs.map((r) => ROLE_NAMES[r]).join(" and ")}` : "That page needs another role"}
          {user ? `, and you are signed in as a ${user.role}.` : "."}
        </p>
        <p>Moderators are appointed by an administrator. If you think your account should have this role, ask one of them.</p>
      </div>
      <p>
        <Link href="/" className="font-semibold">
          Front page
        </Link>{" "}
        · <Link href="/profile">Your profile</Link>
        {!user && (
          <>
            {" "}
            · <Link href="/signin">Sign in</Link>
          </>
        )}
      </p>
    </AccountPage>
  );
}
