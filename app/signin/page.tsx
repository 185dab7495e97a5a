import type { Metadata } from "next";
import Link from "next/link";
import { AccountPage, Card } from "@/components/auth/page-frame";
import { MagicLinkForm, PasswordSignInForm } from "@/components/auth/sign-in-forms";
import { FormMessage } from "@/components/auth/fields";
import { signInErrorMessage } from "@/components/auth/next-auth-client";
import { signInReason } from "@/components/auth/sign-in-reason";
import { currentUser } from "@/lib/auth/guard";
import { safeNextPath } from "@/lib/auth/safe-next";

export const dynamic = "force-dynamic";
export const metadata: Metadata = { title: "Sign in", robots: { index: false } };

type Props = { searchParams: Promise<{ next?: string | string[]; callbackUrl?: string | string[]; error?: string | string[] }> };

const one = (v: string | string[] | undefined) => (Array.isArray(v) ? v[0] : v);

/** next-auth sends back an absolute callbackUrl on errors; keep only its path on this site. */
function nextFrom(next?: string, callbackUrl?: string): string {
  if (next) return safeNextPath(next);
  if (callbackUrl) {
    try {
      const url = new URL(callbackUrl, "http://x");
      return safeNextPath(url.pathname + url.search);
    } catch {
      return "/profile";
    }
  }
  return "/profile";
}

export default async function SignInPage({ searchParams }: Props) {
  const params = await searchParams;
  const next = nextFrom(one(params.next), one(params.callbackUrl));
  const problem = signInErrorMessage(one(params.error));
  // only a page that sent the visitor here explains itself; the plain sign-in link needs no reason
  const reason = one(params.next) || one(params.callbackUrl) ? signInReason(next) : null;
  const user = await currentUser();
  return (
    <AccountPage kicker="Account" title="Sign in" lead="Sign in to send the values you measured and to follow what moderators say about them.">
      {reason && !user && (
        <p className="rounded-md border-2 border-rule bg-sunken px-3 py-2 font-semibold" data-testid="sign-in-reason">
          {reason}
        </p>
      )}
      {problem && <FormMessage tone="fault">{problem}</FormMessage>}
      {user && (
        <FormMessage tone="done">
          You are already signed in as {user.name}. <Link href={next}>Carry on</Link> or <Link href="/signout">sign out</Link>.
        </FormMessage>
      )}
      <div className="grid gap-6 md:grid-cols-2">
        <Card id="with-password" title="With your password">
          <PasswordSignInForm next={next} />
          <p className="mt-4 text-small">
            <Link href="/reset-password">Forgotten the password?</Link>
          </p>
        </Card>
        <Card id="with-link" title="With an e-mailed link">
          <MagicLinkForm next={next} />
        </Card>
      </div>
      <p>
        New here? <Link href={`/signup?next=${encodeURIComponent(next)}`}>Create an account</Link>. Reading the catalogue needs none.
      </p>
    </AccountPage>
  );
}
