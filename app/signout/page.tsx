import type { Metadata } from "next";
import Link from "next/link";
import { AccountPage } from "@/components/auth/page-frame";
import { SignOutButton } from "@/components/auth/sign-out-button";
import { currentUser } from "@/lib/auth/guard";

export const dynamic = "force-dynamic";
export const metadata: Metadata = { title: "Sign out", robots: { index: false } };

export default async function SignOutPage() {
  const user = await currentUser();
  if (!user) {
    return (
      <AccountPage kicker="Account" title="Signed out">
        <p className="text-lead">
          You are not signed in on this device. <Link href="/signin">Sign in</Link> or go to the <Link href="/">front page</Link>.
        </p>
      </AccountPage>
    );
  }
  return (
    <AccountPage kicker="Account" title="Sign out" lead={`Signed in as ${user.name} (${user.email}). Sign out on this device?`}>
      <div className="flex flex-wrap items-start gap-4">
        <SignOutButton />
        <Link href="/profile" className="sb-button sb-button-quiet">
          Stay signed in
        </Link>
      </div>
      <p className="max-w-prose text-small text-muted">
        To sign out everywhere at once, change your password on the profile page: every other device then has to sign in again.
      </p>
    </AccountPage>
  );
}
