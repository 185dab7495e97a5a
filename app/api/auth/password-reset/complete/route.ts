import { route, routes, privateJson } from "@/lib/http";
import { completePasswordReset } from "@/lib/auth/password-reset";
import { ACCOUNT_BODY_BYTES, ResetConfirmSchema } from "@/lib/auth/schemas";

// POST /api/auth/password-reset/complete {token, password, confirm}: sets the new password once
// per link. No rate limit: the token is 256 random bits, beyond guessing.
export const dynamic = "force-dynamic";

export const { GET, POST, PUT, PATCH, DELETE } = routes({
  POST: route({ auth: "public", body: ResetConfirmSchema, maxBytes: ACCOUNT_BODY_BYTES }, async ({ body }) => {
    const { email } = await completePasswordReset(body.token, body.password);
    return privateJson({ email, message: "Your new password is set. Sign in with it." });
  }),
});
