"use client";

import Link from "next/link";
import { useState } from "react";
import { applyFieldErrors, asApiFetchError } from "@/components/form-errors";
import { useConfirmSignUp } from "@/components/hooks/use-account";
import { SignUpConfirmSchema, type SignUpConfirmInput } from "@/lib/auth/schemas";
import { FormMessage, SubmitButton, TextField } from "./fields";
import { nextAuthPost } from "./next-auth-client";
import { useAccountForm } from "./use-account-form";

/** Where a new account goes once signed in: its profile, which says what an account can do. */
const AFTER_SIGN_UP = "/profile";

/**
 * From the mailed link: the password chosen at sign-up finishes the account, then signs in with
 * it. If signing in does not work (a rate limit, a hiccup) the account is still made: say so and
 * send the person to the sign-in page.
 */
export function SignUpConfirmForm({ token }: { token: string }) {
  const { register, fields, setError, formState, problem, setProblem, submit } = useAccountForm<SignUpConfirmInput>(SignUpConfirmSchema, {
    token,
    password: "",
  });
  const confirm = useConfirmSignUp();
  const [made, setMade] = useState(false);
  const onSubmit = submit(
    async (values) => {
      const { email } = await confirm.mutateAsync(values);
      setMade(true);
      const target = new URL(AFTER_SIGN_UP, window.location.origin).toString();
      const signedIn = await nextAuthPost("callback/credentials", { email, password: values.password }, target).then(
        () => true,
        () => false,
      );
      if (signedIn) window.location.assign(target);
    },
    (error) => {
      const refusal = asApiFetchError(error);
      // the token has no field to show beside: its message (an expired or used link) leads the form's
      const rest = applyFieldErrors(setError, refusal.fieldErrors, ["password"]);
      if (refusal.fieldErrors.token) rest.push(...refusal.fieldErrors.token);
      if (rest.length || !Object.keys(refusal.fieldErrors).length) setProblem(rest[0] ?? refusal.message);
    },
  );
  if (made && !formState.isSubmitting) {
    return (
      <FormMessage tone="done">
        Your account is ready. <Link href={`/signin?next=${encodeURIComponent(AFTER_SIGN_UP)}`}>Sign in</Link> with your e-mail address and password.
      </FormMessage>
    );
  }
  const tokenError = formState.errors.token?.message;
  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4">
      {(problem || tokenError) && (
        <FormMessage tone="fault">
          {problem ?? tokenError} <Link href="/signup">Sign up again</Link> or <Link href="/signin">sign in</Link>.
        </FormMessage>
      )}
      <input type="hidden" {...register("token")} />
      <TextField
        form={fields}
        idPrefix="sc"
        name="password"
        label="Password"
        type="password"
        autoComplete="current-password"
        hint="The one you chose when you signed up."
      />
      <SubmitButton submitting={formState.isSubmitting} busyLabel="Finishing…">
        Finish and sign in
      </SubmitButton>
    </form>
  );
}
