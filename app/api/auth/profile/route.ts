import { route, routes, privateJson } from "@/lib/http";
import { hasPassword, updateName } from "@/lib/auth/accounts";
import { ACCOUNT_BODY_BYTES, ProfileNameSchema } from "@/lib/auth/schemas";

// GET /api/auth/profile: who is signed in. PATCH {name}: the name shown beside contributions.
export const dynamic = "force-dynamic";

export const { GET, POST, PUT, PATCH, DELETE } = routes({
  GET: route({ auth: "user" }, async ({ user }) => privateJson({ user, hasPassword: await hasPassword(user.id) })),
  PATCH: route({ auth: "user", body: ProfileNameSchema, maxBytes: ACCOUNT_BODY_BYTES }, async ({ user, body }) =>
    privateJson({ user: await updateName(user.id, body.name) }),
  ),
});
