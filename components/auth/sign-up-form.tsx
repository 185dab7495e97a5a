"use client";

import Link from "next/link";
import { applyFieldErrors, asApiFetchError } from "@/components/form-errors";
import { useSignUp } from "@/components/hooks/use-account";
import { SignUpSchema, type SignUpInput } from "@/lib/auth/schemas";
import { FormMessage, NewPasswordFields, SubmitButton, TextField } from "./fields";
import { nextAuthPost } from "./next-auth-client";
import { useAccountForm } from "./use-account-form";

const FIELDS = ["name", "email", "password", "confirm"] as const;

/** Creates the account, then signs in with the same password and goes on to `next`. */
export function SignUpForm({ next }: { next: string }) {
  const { fields: form, setError, formState, problem, setProblem, submit } = useAccountForm<SignUpInput>(SignUpSchema);
  const signUp = useSignUp();
  const signUpThenSignIn = async (values: SignUpInput) => {
    await signUp.mutateAsync(values);
    const signedIn = await nextAuthPost(
      "callback/credentials",
      { email: values.email, password: values.password },
      new URL(next, window.location.origin).toString(),
    ).then(
      () => true,
      () => false,
    );
    window.location.assign(signedIn ? next : "/signin");
  };
  const onSubmit = submit(signUpThenSignIn, (error) => {
    const refusal = asApiFetchError(error);
    const rest = applyFieldErrors(setError, refusal.fieldErrors, FIELDS);
    // a rate limit names the e-mail field but is about the whole form: say it above too
    if (rest.length || !Object.keys(refusal.fieldErrors).length || refusal.status === 429) setProblem(refusal.message);
  });
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
      <SubmitButton submitting={formState.isSubmitting} busyLabel="Creating the account…">
        Create my account
      </SubmitButton>
      <p className="text-small text-muted">
        Rather not keep a password? <Link href={`/signin?next=${encodeURIComponent(next)}`}>Sign in with an e-mailed link</Link> instead; a new address gets an
        account the same way.
      </p>
    </form>
  );
}
