"use client";

import { useActionState } from "react";
import type { AdminState } from "@/app/admin/actions";

type Action = (prev: AdminState, form: FormData) => Promise<AdminState>;

function Outcome({ state }: { state: AdminState }) {
  if (!state) return null;
  return (
    <p role={state.ok ? "status" : "alert"} className={`text-small font-semibold ${state.ok ? "" : "text-fault"}`}>
      {state.message}
    </p>
  );
}
const fieldError = (state: AdminState, name: string) => state?.fieldErrors?.[name]?.join(" ");

export function UserForm({ action, user }: { action: Action; user: { id: string; name: string; role: string; override: boolean | null } }) {
  const [state, formAction, pending] = useActionState(action, null);
  const roleError = fieldError(state, "role");
  return (
    <form action={formAction} className="flex flex-wrap items-end gap-2" aria-label={`Role and trust of ${user.name}`}>
      <input type="hidden" name="userId" value={user.id} />
      <label className="flex flex-col text-small font-semibold">
        Role
        <select name="role" defaultValue={user.role} className="sb-field min-h-11" aria-invalid={roleError ? "true" : undefined}>
          <option value="contributor">Contributor</option>
          <option value="moderator">Moderator</option>
          <option value="admin">Admin</option>
        </select>
      </label>
      <label className="flex flex-col text-small font-semibold">
        Trust
        <select name="trusted" defaultValue={user.override === true ? "yes" : user.override === false ? "no" : "record"} className="sb-field min-h-11">
          <option value="record">By their record</option>
          <option value="yes">Always trusted</option>
          <option value="no">Never auto-approved</option>
        </select>
      </label>
      <label className="flex flex-col text-small font-semibold">
        Reason (optional)
        <input name="reason" className="sb-field min-h-11" />
      </label>
      <button type="submit" className="sb-button sb-button-quiet min-h-11" disabled={pending}>
        Save
      </button>
      {roleError && <p className="w-full text-small font-semibold text-fault">{roleError}</p>}
      <Outcome state={state} />
    </form>
  );
}

export function RevertForm({ action, eventId }: { action: Action; eventId: number }) {
  const [state, formAction, pending] = useActionState(action, null);
  const reasonError = fieldError(state, "reason");
  return (
    <form action={formAction} noValidate className="flex flex-wrap items-end gap-2" aria-label={`Revert event ${eventId}`}>
      <input type="hidden" name="eventId" value={eventId} />
      <label className="flex flex-col text-small font-semibold">
        Why revert (required)
        <input name="reason" className="sb-field min-h-11" aria-invalid={reasonError ? "true" : undefined} />
      </label>
      <button type="submit" className="sb-button sb-button-quiet min-h-11" disabled={pending}>
        Revert
      </button>
      {reasonError && <p className="w-full text-small font-semibold text-fault">{reasonError}</p>}
      {!state?.ok && !reasonError && <Outcome state={state} />}
      {state?.ok && <Outcome state={state} />}
    </form>
  );
}
