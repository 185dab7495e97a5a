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
import { formProblem } from "@/components/form-errors";
import { useSaveName, useSavePassword } from "@/components/hooks/use-account";
import { FormMessage, NewPasswordFields, SubmitButton, TextField } from "./fields";

export function NameForm({ name }: { name: string }) {
  const router = useRouter();
  const { register, handleSubmit, setError, formState, reset } = useForm<ProfileNameInput>({
    resolver: zodResolver(ProfileNameSchema),
    mode: "onTouched",
    defaultValues: { name },
  });
  const saveName = useSaveName();
  const [message, setMessage] = useState<{ tone: "fault" | "done"; text: string } | null>(null);
  const onSubmit = handleSubmit(async (values) => {
    setMessage(null);
    try {
      const { user } = await saveName.mutateAsync(values);
      reset({ name: user.name });
      setMessage({ tone: "done", text: "Name saved." });
      router.refresh(); // the header shows the new name
    } catch (error) {
      const problem = formProblem(setError, error, ["name"]);
      if (problem) setMessage({ tone: "fault", text: problem });
    }
  });
  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4">
      {message && <FormMessage tone={message.tone}>{message.text}</FormMessage>}
      <TextField
        form={{ register, errors: formState.errors }}
        idPrefix="pf"
        name="name"
        label="Name"
        autoComplete="nickname"
        hint="Shown beside your contributions."
      />
      <SubmitButton submitting={formState.isSubmitting} className="sb-button">
        Save the name
      </SubmitButton>
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
  const savePassword = useSavePassword();
  const [message, setMessage] = useState<{ tone: "fault" | "done"; text: string } | null>(null);
  const form = { register, errors: formState.errors };
  const onSubmit = handleSubmit(async (values) => {
    setMessage(null);
    try {
      const saved = await savePassword.mutateAsync(values);
      reset({ currentPassword: "", newPassword: "", confirm: "" });
      setMessage({ tone: "done", text: saved.message });
    } catch (error) {
      const problem = formProblem(setError, error, ["currentPassword", "newPassword", "confirm"]);
      if (problem) setMessage({ tone: "fault", text: problem });
    }
  });
  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4">
      {message && <FormMessage tone={message.tone}>{message.text}</FormMessage>}
      {hasPassword && (
        <TextField
          form={form}
          idPrefix="pw-change"
          name={"currentPassword" as never}
          label="Current password"
          type="password"
          autoComplete="current-password"
        />
      )}
      <NewPasswordFields
        form={form}
        idPrefix="pw-change"
        name="newPassword"
        label="New password"
        hint="At least 10 characters. Other devices are signed out when it changes."
      />
      <SubmitButton submitting={formState.isSubmitting} className="sb-button">
        {hasPassword ? "Change the password" : "Set a password"}
      </SubmitButton>
    </form>
  );
}
