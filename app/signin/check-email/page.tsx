import type { Metadata } from "next";
import Link from "next/link";
import { AccountPage } from "@/components/auth/page-frame";
import { emailField } from "@/lib/auth/schemas";

export const metadata: Metadata = { title: "Check your mail", robots: { index: false } };

type Props = { searchParams: Promise<{ email?: string | string[] }> };

export default async function CheckEmailPage({ searchParams }: Props) {
  const raw = (await searchParams).email;
  const parsed = emailField.safeParse(Array.isArray(raw) ? raw[0] : raw);
  return (
    <AccountPage kicker="Account" title="Check your mail">
      <div className="max-w-prose space-y-4 text-lead">
        <p>
          A sign-in link is on its way
          {parsed.success ? (
            <>
              {" "}
              to <strong className="font-mono">{parsed.data}</strong>
            </>
          ) : null}
          . Open it on this device within 15 minutes; it works once.
        </p>
        <p>Nothing after a few minutes? Look in the spam folder, or ask again.</p>
      </div>
      <p>
        <Link href="/signin" className="font-semibold">
          Back to sign-in
        </Link>
      </p>
    </AccountPage>
  );
}
