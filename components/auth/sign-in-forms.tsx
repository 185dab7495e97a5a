"use client";

import { useRouter } from "next/navigation";
import { applyFieldErrors, asApiFetchError, formProblem } from "@/components/form-errors";
import { MagicLinkSchema, SignInSchema, type MagicLinkInput, type SignInInput } from "@/lib/auth/schemas";
import { FormMessage, SubmitButton, TextField } from "./fields";
import { nextAuthPost } from "./next-auth-client";
import { useAccountForm } from "./use-account-form";

const callbackFor = (next: string) => new URL(next, window.location.origin).toString();

/** E-mail and password. On success the whole page reloads at `next`, so the header shows the account. */
export function PasswordSignInForm({ next }: { next: string }) {
  const { fields, setError, formState, problem, setProblem, submit } = useAccountForm<SignInInput>(SignInSchema);
  const onSubmit = submit(
    async (values) => {
      await nextAuthPost("callback/credentials", values, callbackFor(next));
      window.location.assign(next);
    },
    (error) => {
      const refusal = asApiFetchError(error);
      applyFieldErrors(setError, refusal.fieldErrors, ["email", "password"]);
      // always said: a wrong password is no one field's fault
      setProblem(refusal.message);
    },
  );
  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4" aria-describedby={problem ? "password-signin-problem" : undefined}>
      {problem && (
        <div id="password-signin-problem">
          <FormMessage tone="fault">{problem}</FormMessage>
        </div>
      )}
      <TextField form={fields} idPrefix="pw" name="email" label="E-mail address" type="email" autoComplete="email" />
      <TextField form={fields} idPrefix="pw" name="password" label="Password" type="password" autoComplete="current-password" />
      <SubmitButton submitting={formState.isSubmitting} busyLabel="Checking…">
        Sign in
      </SubmitButton>
    </form>
  );
}

/** A one-time link by e-mail; no password needed, and a new address gets an account. */
export function MagicLinkForm({ next }: { next: string }) {
  const router = useRouter();
  const { fields, setError, formState, problem, setProblem, submit } = useAccountForm<MagicLinkInput>(MagicLinkSchema);
  const onSubmit = submit(
    async (values) => {
      await nextAuthPost("signin/email", { email: values.email }, callbackFor(next));
      // nobody is signed in yet, so nothing on the page is stale: a client navigation will do
      router.push(`/signin/check-email?email=${encodeURIComponent(values.email)}`);
    },
    (error) => setProblem(formProblem(setError, error, ["email"])),
  );
  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4">
      {problem && <FormMessage tone="fault">{problem}</FormMessage>}
      <TextField
        form={fields}
        idPrefix="link"
        name="email"
        label="E-mail address"
        type="email"
        autoComplete="email"
        hint="We mail you a link that signs you in once, within 15 minutes."
      />
      <SubmitButton submitting={formState.isSubmitting} className="sb-button sb-button-quiet w-full sm:w-auto" busyLabel="Sending…">
        Mail me a sign-in link
      </SubmitButton>
    </form>
  );
}
