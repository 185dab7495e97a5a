import { route, routes, privateJson } from "@/lib/http";
import { completeSignUp } from "@/lib/auth/sign-up";
import { ACCOUNT_BODY_BYTES, SignUpConfirmSchema } from "@/lib/auth/schemas";

// POST /api/auth/sign-up/confirm {token, password}: makes the account a mailed sign-up link stands
// for, once. No rate limit of its own: the token is 256 random bits, beyond guessing, and only the
// mailbox's owner has it. The page then signs in with the same password through next-auth.
export const dynamic = "force-dynamic";

export const { GET, POST, PUT, PATCH, DELETE } = routes({
  POST: route({ auth: "public", body: SignUpConfirmSchema, maxBytes: ACCOUNT_BODY_BYTES }, async ({ body }) => {
    const { email } = await completeSignUp(body.token, body.password);
    return privateJson({ email, message: "Your account is ready." }, 201);
  }),
});
