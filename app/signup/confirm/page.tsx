import type { Metadata } from "next";
import Link from "next/link";
import { AccountPage, Card } from "@/components/auth/page-frame";
import { SignUpConfirmForm } from "@/components/auth/sign-up-confirm-form";
import { FormMessage } from "@/components/auth/fields";
import { signUpTokenField } from "@/lib/auth/schemas";

export const dynamic = "force-dynamic";
export const metadata: Metadata = { title: "Finish your account", robots: { index: false }, referrer: "no-referrer" };

type Props = { searchParams: Promise<{ token?: string | string[] }> };

// The page a sign-up mail links to. The password chosen at sign-up finishes the account, so a link
// that reached the wrong inbox makes nothing. The page sends no Referer, so the token in its
// address never leaks to another site.
export default async function SignUpConfirmPage({ searchParams }: Props) {
  const raw = (await searchParams).token;
  const checked = signUpTokenField.safeParse(Array.isArray(raw) ? raw[0] : raw);
  return (
    <AccountPage kicker="Account" title="Finish your account" lead="Enter the password you chose when you signed up. Then you are in.">
      <div className="max-w-xl">
        {checked.success ? (
          <Card id="sign-up-confirm" title="Your password">
            <SignUpConfirmForm token={checked.data} />
          </Card>
        ) : (
          <FormMessage tone="fault">
            {raw === undefined ? "This page needs the link from your sign-up mail." : checked.error.issues[0].message} <Link href="/signup">Sign up again</Link>{" "}
            or <Link href="/signin">sign in</Link>.
          </FormMessage>
        )}
      </div>
    </AccountPage>
  );
}
