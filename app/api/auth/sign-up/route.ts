import { route, routes, privateJson, tooManyRequests } from "@/lib/http";
import { signUp } from "@/lib/auth/accounts";
import { clientAddress } from "@/lib/auth/client-address";
import { spendAttempt } from "@/lib/auth/rate-limit";
import { ACCOUNT_BODY_BYTES, SignUpSchema } from "@/lib/auth/schemas";

// POST /api/auth/sign-up {name, email, password, confirm}: a contributor account. The page then
// signs in with the same password through next-auth.
export const dynamic = "force-dynamic";

export const { GET, POST, PUT, PATCH, DELETE } = routes({
  POST: route({ auth: "public", body: SignUpSchema, maxBytes: ACCOUNT_BODY_BYTES }, async ({ req, body }) => {
    const verdict = await spendAttempt("signUp", clientAddress(req.headers)); // per network, whatever the address
    if (!verdict.ok) return tooManyRequests(verdict.message, verdict.retryAfterSeconds);
    return privateJson({ user: await signUp(body) }, 201);
  }),
});
