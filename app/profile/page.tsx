import type { Metadata } from "next";
import Link from "next/link";
import { AccountPage, Card } from "@/components/auth/page-frame";
import { NameForm, PasswordForm } from "@/components/auth/profile-forms";
import { SignOutEverywhere } from "@/components/auth/sign-out-everywhere";
import { hasPassword } from "@/lib/auth/accounts";
import { requirePageUser } from "@/lib/auth/guard";

export const dynamic = "force-dynamic";
export const metadata: Metadata = { title: "Your profile", robots: { index: false } };

const ROLE_WORDS = {
  contributor: "Contributor: you can send values and evidence for review.",
  moderator: "Moderator: you review contributions as well as sending your own.",
  admin: "Administrator: you can do everything a moderator can, and appoint moderators.",
} as const;

export default async function ProfilePage() {
  const user = await requirePageUser("/profile");
  const withPassword = await hasPassword(user.id);
  return (
    <AccountPage kicker="Account" title="Your profile">
      <dl className="grid max-w-2xl gap-x-6 gap-y-2 rounded-md border-3 border-rule bg-surface p-4 sm:grid-cols-[auto_1fr] sm:p-6">
        <dt className="font-display font-bold tracking-wider uppercase">Name</dt>
        <dd data-testid="profile-name">{user.name}</dd>
        <dt className="font-display font-bold tracking-wider uppercase">E-mail</dt>
        <dd className="font-mono break-all" data-testid="profile-email">
          {user.email}
        </dd>
        <dt className="font-display font-bold tracking-wider uppercase">Role</dt>
        <dd data-testid="profile-role">{ROLE_WORDS[user.role]}</dd>
      </dl>
      <div className="grid gap-6 md:grid-cols-2">
        <Card id="change-name" title="Name">
          <NameForm name={user.name} />
        </Card>
        <Card id="change-password" title={withPassword ? "Password" : "Add a password"}>
          {!withPassword && (
            <p className="mb-4 text-small text-muted">
              You sign in with e-mailed links. Add a password if you would also like to sign in without waiting for a mail.
            </p>
          )}
          <PasswordForm hasPassword={withPassword} />
        </Card>
        <Card id="sign-out-everywhere" title="Devices">
          <SignOutEverywhere />
        </Card>
      </div>
      <p>
        <Link href="/my/submissions">My submissions</Link> · <Link href="/signout">Sign out</Link>
      </p>
    </AccountPage>
  );
}
