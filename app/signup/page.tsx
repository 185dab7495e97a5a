import type { Metadata } from "next";
import Link from "next/link";
import { AccountPage, Card } from "@/components/auth/page-frame";
import { SignUpForm } from "@/components/auth/sign-up-form";
import { FormMessage } from "@/components/auth/fields";
import { currentUser } from "@/lib/auth/guard";
import { safeNextPath } from "@/lib/auth/safe-next";

export const dynamic = "force-dynamic";
export const metadata: Metadata = { title: "Create an account", robots: { index: false } };

type Props = { searchParams: Promise<{ next?: string | string[] }> };

export default async function SignUpPage({ searchParams }: Props) {
  const raw = (await searchParams).next;
  const next = safeNextPath(Array.isArray(raw) ? raw[0] : raw);
  const user = await currentUser();
  return (
    <AccountPage
      kicker="Account"
      title="Create an account"
      lead="An account lets you contribute the values you measured. New accounts start as contributors; moderators are appointed."
    >
      {user && (
        <FormMessage tone="done">
          You are signed in as {user.name}. <Link href="/signout">Sign out</Link> first to make another account.
        </FormMessage>
      )}
      <div className="max-w-xl">
        <Card id="new-account" title="Your details">
          <SignUpForm next={next} />
        </Card>
      </div>
      <p>
        Already have one? <Link href={`/signin?next=${encodeURIComponent(next)}`}>Sign in</Link>.
      </p>
    </AccountPage>
  );
}
