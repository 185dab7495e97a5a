import { route, routes, parseBody, privateJson } from "@/lib/http";
import { changePassword, hasPassword } from "@/lib/auth/accounts";
import { ACCOUNT_BODY_BYTES, ChangePasswordSchema, SetPasswordSchema } from "@/lib/auth/schemas";
import { encodeSessionToken, sessionSetCookie } from "@/lib/auth/session-cookie";
import { currentSessionVersion } from "@/lib/auth/sessions";

// POST /api/auth/profile/password {currentPassword, newPassword, confirm}: changes the password
// (an account without one, made by magic link, sets its first without currentPassword). The
// change signs out every other session; this one gets a fresh cookie so it stays signed in.
export const dynamic = "force-dynamic";

export const { GET, POST, PUT, PATCH, DELETE } = routes({
  POST: route({ auth: "user", body: "json", maxBytes: ACCOUNT_BODY_BYTES }, async ({ user: me, body }) => {
    const input = parseBody((await hasPassword(me.id)) ? ChangePasswordSchema : SetPasswordSchema, body);
    const changedAt = await changePassword(me.id, input);
    const token = await encodeSessionToken({
      sub: me.id,
      email: me.email,
      name: me.name,
      role: me.role,
      authTime: changedAt.getTime(),
      sessionVersion: await currentSessionVersion(me.id),
    });
    return privateJson({ message: "Your password is changed. Other devices are signed out." }, 200, { "Set-Cookie": sessionSetCookie(token) });
  }),
});
