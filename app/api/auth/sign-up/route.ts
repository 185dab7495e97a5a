import { route, routes, privateJson, tooManyRequests } from "@/lib/http";
import { requestSignUp, SIGN_UP_TOKEN_HOURS } from "@/lib/auth/sign-up";
import { clientAddress } from "@/lib/auth/client-address";
import { accountKey, spendAttempts } from "@/lib/auth/rate-limit";
import { ACCOUNT_BODY_BYTES, SignUpSchema } from "@/lib/auth/schemas";

// POST /api/auth/sign-up {name, email, password, confirm}: asks for a contributor account. The
// answer is the same, in the same time, whether or not the address has an account (202, "check
// your mail"): the lookup and the mail happen in a queued job (lib/auth/sign-up.ts). A new
// address gets a link to /signup/confirm, which makes the account; a taken one gets a note.
export const dynamic = "force-dynamic";

export const { GET, POST, PUT, PATCH, DELETE } = routes({
  POST: route({ auth: "public", body: SignUpSchema, maxBytes: ACCOUNT_BODY_BYTES }, async ({ req, body }) => {
    // per network whatever the address, and per mailbox from anywhere (bounds the mails one person gets)
    const verdict = await spendAttempts(["signUp", clientAddress(req.headers)], ["signUpMailbox", accountKey(body.email)]);
    if (!verdict.ok) return tooManyRequests(verdict.message, verdict.retryAfterSeconds);
    await requestSignUp(body);
    const message = `Check your mail: we sent the next step to ${body.email}. A link in it works for ${SIGN_UP_TOKEN_HOURS} hours.`;
    return privateJson({ message }, 202);
  }),
});
