import { apiRoute } from "@/lib/api/handler";
import { accountJson, readBody } from "@/lib/auth/http";
import { completePasswordReset } from "@/lib/auth/password-reset";
import { assertSameOrigin } from "@/lib/auth/same-origin";
import { ResetConfirmSchema } from "@/lib/auth/schemas";

// POST /api/auth/password-reset/complete {token, password, confirm}: sets the new password once
// per link. No rate limit: the token is 256 random bits, beyond guessing.
export const dynamic = "force-dynamic";

export const POST = apiRoute(async (request) => {
  assertSameOrigin(request);
  const { token, password } = await readBody(request, ResetConfirmSchema);
  const { email } = await completePasswordReset(token, password);
  return accountJson({ email, message: "Your new password is set. Sign in with it." });
});
