import { z } from "zod";
import { route, routes, privateJson } from "@/lib/http";
import { sessionClearCookie } from "@/lib/auth/session-cookie";
import { endSessions } from "@/lib/auth/sessions";

// POST /api/auth/profile/sign-out-everywhere: ends every session of the signed-in account, on
// every device, this one included (its cookie is deleted too). Its body is an empty JSON object: a
// JSON body makes a cross-site form or fetch a preflighted request, which this API never grants.
export const dynamic = "force-dynamic";

export const { GET, POST, PUT, PATCH, DELETE } = routes({
  POST: route({ auth: "user", body: z.object({}, { error: "Send an empty JSON object" }) }, async ({ user }) => {
    await endSessions(user.id);
    return privateJson({ message: "Every device is signed out, this one too." }, 200, {
      "Set-Cookie": sessionClearCookie(),
    });
  }),
});
