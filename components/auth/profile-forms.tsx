"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm } from "react-hook-form";
import {
  ChangePasswordSchema,
  ProfileNameSchema,
  SetPasswordSchema,
  type ChangePasswordInput,
  type ProfileNameInput,
  type SetPasswordInput,
} from "@/lib/auth/schemas";
import { accountRequest } from "./auth-client";
import { applyFieldErrors, FormMessage, TextField } from "./fields";

export function NameForm({ name }: { name: string }) {
  const router = useRouter();
  const { register, handleSubmit, setError, formState, reset } = useForm<ProfileNameInput>({
    resolver: zodResolver(ProfileNameSchema),
    mode: "onTouched",
    defaultValues: { name },
  });
  const [message, setMessage] = useState<{ tone: "fault" | "done"; text: string } | null>(null);
  const onSubmit = handleSubmit(async (values) => {
    setMessage(null);
    const result = await accountRequest("/api/auth/profile", "PATCH", values);
    if (result.ok) {
      const saved = (result.body as { user: { name: string } }).user.name;
      reset({ name: saved });
      setMessage({ tone: "done", text: "Name saved." });
      return router.refresh(); // the header shows the new name
    }
    const rest = applyFieldErrors(setError, result.fieldErrors, ["name"]);
    if (rest.length || !Object.keys(result.fieldErrors).length) setMessage({ tone: "fault", text: result.message });
  });
  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4">
      {message && <FormMessage tone={message.tone}>{message.text}</FormMessage>}
      <TextField form={{ register, errors: formState.errors }} idPrefix="pf" name="name" label="Name" autoComplete="nickname" hint="Shown beside your contributions." />
      <button type="submit" className="sb-button" disabled={formState.isSubmitting}>
        Save the name
      </button>
    </form>
  );
}

type PasswordValues = ChangePasswordInput | SetPasswordInput;

/** Change the password (or set a first one, for an account made by e-mailed link). */
export function PasswordForm({ hasPassword }: { hasPassword: boolean }) {
  const { register, handleSubmit, setError, formState, reset } = useForm<PasswordValues>({
    resolver: zodResolver(hasPassword ? ChangePasswordSchema : SetPasswordSchema),
    mode: "onTouched",
  });
  const [message, setMessage] = useState<{ tone: "fault" | "done"; text: string } | null>(null);
  const form = { register, errors: formState.errors };
  const onSubmit = handleSubmit(async (values) => {
    setMessage(null);
    const result = await accountRequest("/api/auth/profile/password", "POST", values);
    if (result.ok) {
      reset({ currentPassword: "", newPassword: "", confirm: "" });
      return setMessage({ tone: "done", text: (result.body as { message: string }).message });
    }
    const rest = applyFieldErrors(setError, result.fieldErrors, ["currentPassword", "newPassword", "confirm"]);
    if (rest.length || !Object.keys(result.fieldErrors).length) setMessage({ tone: "fault", text: result.message });
  });
  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4">
      {message && <FormMessage tone={message.tone}>{message.text}</FormMessage>}
      {hasPassword && (
        <TextField form={form} idPrefix="pw-change" name={"currentPassword" as never} label="Current password" type="password" autoComplete="current-password" />
      )}
      <TextField form={form} idPrefix="pw-change" name="newPassword" label="New password" type="password" autoComplete="new-password" hint="At least 10 characters. Other devices are signed out when it changes." />
      <TextField form={form} idPrefix="pw-change" name="confirm" label="New password again" type="password" autoComplete="new-password" />
      <button type="submit" className="sb-button" disabled={formState.isSubmitting}>
        {hasPassword ? "Change the password" : "Set a password"}
      </button>
    </form>
  );
}
