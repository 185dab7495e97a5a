import { apiRoute } from "@/lib/api/handler";
import { signUp } from "@/lib/auth/accounts";
import { accountJson, readBody, tooManyRequests } from "@/lib/auth/http";
import { clientIp, limitKey, spendAttempt } from "@/lib/auth/rate-limit";
import { assertSameOrigin } from "@/lib/auth/same-origin";
import { SignUpSchema } from "@/lib/auth/schemas";

// POST /api/auth/sign-up {name, email, password, confirm}: a contributor account. The page then
// signs in with the same password through next-auth.
export const dynamic = "force-dynamic";

export const POST = apiRoute(async (request) => {
  assertSameOrigin(request);
  const input = await readBody(request, SignUpSchema);
  const verdict = await spendAttempt("signUp", limitKey(clientIp(request.headers), input.email));
  if (!verdict.ok) return tooManyRequests(verdict.message, verdict.retryAfterSeconds);
  const user = await signUp(input);
  return accountJson({ user }, 201);
});
