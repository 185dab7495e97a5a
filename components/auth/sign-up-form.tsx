"use client";

import Link from "next/link";
import { useState } from "react";
import { applyFieldErrors, asApiFetchError } from "@/components/form-errors";
import { useSignUp } from "@/components/hooks/use-account";
import { SignUpSchema, type SignUpInput } from "@/lib/auth/schemas";
import { FormMessage, NewPasswordFields, SubmitButton, TextField } from "./fields";
import { useAccountForm } from "./use-account-form";

const FIELDS = ["name", "email", "password", "confirm"] as const;

/**
 * Asks for the account. The answer is "check your mail" whatever the address: the mail carries the
 * link that finishes the account (components/auth/sign-up-confirm-form.tsx), or, for an address
 * that already has one, the way to sign in.
 */
export function SignUpForm({ next }: { next: string }) {
  const { fields: form, setError, formState, problem, setProblem, submit } = useAccountForm<SignUpInput>(SignUpSchema);
  const signUp = useSignUp();
  const [sent, setSent] = useState<string | null>(null);
  const onSubmit = submit(
    async (values) => setSent((await signUp.mutateAsync(values)).message),
    (error) => {
      const refusal = asApiFetchError(error);
      const rest = applyFieldErrors(setError, refusal.fieldErrors, FIELDS);
      // a rate limit names the e-mail field but is about the whole form: say it above too
      if (rest.length || !Object.keys(refusal.fieldErrors).length || refusal.status === 429) setProblem(refusal.message);
    },
  );
  if (sent) return <FormMessage tone="done">{sent} Check the spam folder too.</FormMessage>;
  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4">
      {problem && <FormMessage tone="fault">{problem}</FormMessage>}
      <TextField form={form} idPrefix="su" name="name" label="Name" autoComplete="nickname" hint="Shown beside your contributions. A handle is fine." />
      <TextField
        form={form}
        idPrefix="su"
        name="email"
        label="E-mail address"
        type="email"
        autoComplete="email"
        hint="For sign-in links and password resets only; never shown."
      />
      <NewPasswordFields form={form} idPrefix="su" name="password" label="Password" hint="At least 10 characters. A few unrelated words work well." />
      <SubmitButton submitting={formState.isSubmitting} busyLabel="Sending…">
        Create my account
      </SubmitButton>
      <p className="text-small text-muted">
        Rather not keep a password? <Link href={`/signin?next=${encodeURIComponent(next)}`}>Sign in with an e-mailed link</Link> instead; a new address gets an
        account the same way.
      </p>
    </form>
  );
}
