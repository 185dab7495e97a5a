"use client";

import Link from "next/link";
import { useState } from "react";
import { ResetConfirmSchema, ResetRequestSchema, type ResetConfirmInput, type ResetRequestInput } from "@/lib/auth/schemas";
import { applyFieldErrors, asApiFetchError, formProblem } from "@/components/form-errors";
import { useCompleteReset, useRequestReset } from "@/components/hooks/use-account";
import { FormMessage, NewPasswordFields, SubmitButton, TextField } from "./fields";
import { useAccountForm } from "./use-account-form";

/** Step 1: an address; the answer never says whether an account has it. */
export function ResetRequestForm() {
  const { fields, setError, formState, problem, setProblem, submit } = useAccountForm<ResetRequestInput>(ResetRequestSchema);
  const requestReset = useRequestReset();
  const [sent, setSent] = useState<string | null>(null);
  const onSubmit = submit(
    async (values) => setSent((await requestReset.mutateAsync(values)).message),
    (error) => setProblem(formProblem(setError, error, ["email"])),
  );
  if (sent) return <FormMessage tone="done">{sent} Check the spam folder too.</FormMessage>;
  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4">
      {problem && <FormMessage tone="fault">{problem}</FormMessage>}
      <TextField form={fields} idPrefix="rr" name="email" label="E-mail address of the account" type="email" autoComplete="email" />
      <SubmitButton submitting={formState.isSubmitting} busyLabel="Sending…">
        Mail me a reset link
      </SubmitButton>
    </form>
  );
}

/** Step 2: from the mailed link, a new password. */
export function ResetCompleteForm({ token }: { token: string }) {
  const { register, fields, setError, formState, problem, setProblem, submit } = useAccountForm<ResetConfirmInput>(ResetConfirmSchema, {
    token,
    password: "",
    confirm: "",
  });
  const completeReset = useCompleteReset();
  const [done, setDone] = useState(false);
  const onSubmit = submit(
    async (values) => {
      await completeReset.mutateAsync(values);
      setDone(true);
    },
    (error) => {
      const refusal = asApiFetchError(error);
      // the token has no field to show beside: its message (an expired or used link) leads the form's
      const rest = applyFieldErrors(setError, refusal.fieldErrors, ["password", "confirm"]);
      if (refusal.fieldErrors.token) rest.push(...refusal.fieldErrors.token);
      if (rest.length || !Object.keys(refusal.fieldErrors).length) setProblem(rest[0] ?? refusal.message);
    },
  );
  if (done) {
    return (
      <FormMessage tone="done">
        Your new password is set, and any other device signed in to this account is now signed out. <Link href="/signin">Sign in with the new password</Link>.
      </FormMessage>
    );
  }
  const tokenError = formState.errors.token?.message;
  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4">
      {(problem || tokenError) && (
        <FormMessage tone="fault">
          {problem ?? tokenError} <Link href="/reset-password">Ask for a new link</Link>.
        </FormMessage>
      )}
      <input type="hidden" {...register("token")} />
      <NewPasswordFields form={fields} idPrefix="rc" name="password" label="New password" hint="At least 10 characters." />
      <SubmitButton submitting={formState.isSubmitting} busyLabel="Saving…">
        Set the new password
      </SubmitButton>
    </form>
  );
}
