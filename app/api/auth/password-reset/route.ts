import { route, routes, privateJson, tooManyRequests } from "@/lib/http";
import { queuePasswordReset, RESET_TOKEN_MINUTES } from "@/lib/auth/password-reset";
import { clientAddress } from "@/lib/auth/client-address";
import { accountKey, limitKey, spendAttempts } from "@/lib/auth/rate-limit";
import { ACCOUNT_BODY_BYTES, ResetRequestSchema } from "@/lib/auth/schemas";

// POST /api/auth/password-reset {email}: mails a reset link if an account has that address. The
// answer is the same, in the same time, whether or not one does (202), so the form tells nobody
// who is registered.
export const dynamic = "force-dynamic";

export const { GET, POST, PUT, PATCH, DELETE } = routes({
  POST: route({ auth: "public", body: ResetRequestSchema, maxBytes: ACCOUNT_BODY_BYTES }, async ({ req, body: { email } }) => {
    const address = clientAddress(req.headers);
    const verdict = await spendAttempts(["resetAddress", address], ["passwordReset", limitKey(address, email)], ["resetMailbox", accountKey(email)]);
    if (!verdict.ok) return tooManyRequests(verdict.message, verdict.retryAfterSeconds);
    await queuePasswordReset(email); // the lookup, token and mail happen in the job: same time for every address
    const message = `If an account uses ${email}, a reset link is on its way. It works for ${RESET_TOKEN_MINUTES} minutes.`;
    return privateJson({ message }, 202);
  }),
});
