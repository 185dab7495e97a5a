import type { Metadata } from "next";
import Link from "next/link";
import { AccountPage, Card } from "@/components/auth/page-frame";
import { ResetCompleteForm, ResetRequestForm } from "@/components/auth/reset-forms";
import { FormMessage } from "@/components/auth/fields";
import { resetTokenField } from "@/lib/auth/schemas";

export const dynamic = "force-dynamic";
export const metadata: Metadata = { title: "Reset the password", robots: { index: false }, referrer: "no-referrer" };

type Props = { searchParams: Promise<{ token?: string | string[] }> };

// Without ?token: ask for a link. With one (from the mail): choose the new password. The page
// sends no Referer, so the token in its address never leaks to another site.
export default async function ResetPasswordPage({ searchParams }: Props) {
  const raw = (await searchParams).token;
  const token = Array.isArray(raw) ? raw[0] : raw;
  if (token === undefined) {
    return (
      <AccountPage kicker="Account" title="Reset the password" lead="Give the address you signed up with. We mail a link to choose a new password.">
        <div className="max-w-xl">
          <Card id="reset-request" title="Your e-mail address">
            <ResetRequestForm />
          </Card>
        </div>
        <p>
          Remembered it? <Link href="/signin">Sign in</Link>. No password at all? An <Link href="/signin">e-mailed sign-in link</Link> works too.
        </p>
      </AccountPage>
    );
  }
  const checked = resetTokenField.safeParse(token);
  return (
    <AccountPage kicker="Account" title="Choose a new password">
      <div className="max-w-xl">
        {checked.success ? (
          <Card id="reset-complete" title="New password">
            <ResetCompleteForm token={checked.data} />
          </Card>
        ) : (
          <FormMessage tone="fault">
            {checked.error.issues[0].message} <Link href="/reset-password">Ask for a new link</Link>.
          </FormMessage>
        )}
      </div>
    </AccountPage>
  );
}
