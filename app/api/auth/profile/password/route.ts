import { apiRoute } from "@/lib/api/handler";
import { changePassword, hasPassword } from "@/lib/auth/accounts";
import { signedIn, userFromRequest } from "@/lib/auth/guard";
import { accountJson, readBody } from "@/lib/auth/http";
import { ChangePasswordSchema, SetPasswordSchema } from "@/lib/auth/schemas";
import { encodeSessionToken, sessionSetCookie } from "@/lib/auth/session-cookie";

// POST /api/auth/profile/password {currentPassword, newPassword, confirm}: changes the password
// (an account without one, made by magic link, sets its first without currentPassword). The
// change signs out every other session; this one gets a fresh cookie so it stays signed in.
export const dynamic = "force-dynamic";

export const POST = apiRoute(
  async (request) => {
    const me = (await userFromRequest(request))!;
    const input = (await hasPassword(me.id)) ? await readBody(request, ChangePasswordSchema) : await readBody(request, SetPasswordSchema);
    const changedAt = await changePassword(me.id, input);
    const token = await encodeSessionToken({ sub: me.id, email: me.email, name: me.name, role: me.role, authTime: changedAt.getTime() });
    return accountJson({ message: "Your password is changed. Other devices are signed out." }, 200, { "Set-Cookie": sessionSetCookie(token) });
  },
  { guard: signedIn },
);
