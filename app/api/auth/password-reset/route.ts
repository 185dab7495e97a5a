import { apiRoute } from "@/lib/api/handler";
import { accountJson, readBody, tooManyRequests } from "@/lib/auth/http";
import { requestPasswordReset, RESET_TOKEN_MINUTES } from "@/lib/auth/password-reset";
import { clientIp, limitKey, spendAttempt } from "@/lib/auth/rate-limit";
import { assertSameOrigin } from "@/lib/auth/same-origin";
import { ResetRequestSchema } from "@/lib/auth/schemas";

// POST /api/auth/password-reset {email}: mails a reset link if an account has that address. The
// answer is the same whether or not one does (202), so the form tells nobody who is registered.
export const dynamic = "force-dynamic";

export const POST = apiRoute(async (request) => {
  assertSameOrigin(request);
  const { email } = await readBody(request, ResetRequestSchema);
  const verdict = await spendAttempt("passwordReset", limitKey(clientIp(request.headers), email));
  if (!verdict.ok) return tooManyRequests(verdict.message, verdict.retryAfterSeconds);
  await requestPasswordReset(email);
  return accountJson(
    { message: `If an account uses ${email}, a reset link is on its way. It works for ${RESET_TOKEN_MINUTES} minutes.` },
    202,
  );
});
