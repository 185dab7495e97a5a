import { apiRoute } from "@/lib/api/handler";
import { hasPassword, updateName } from "@/lib/auth/accounts";
import { signedIn, userFromRequest } from "@/lib/auth/guard";
import { accountJson, readBody } from "@/lib/auth/http";
import { ProfileNameSchema } from "@/lib/auth/schemas";

// GET /api/auth/profile: who is signed in. PATCH {name}: the name shown beside contributions.
export const dynamic = "force-dynamic";

export const GET = apiRoute(
  async (request) => {
    const user = (await userFromRequest(request))!;
    return accountJson({ user, hasPassword: await hasPassword(user.id) });
  },
  { guard: signedIn },
);

export const PATCH = apiRoute(
  async (request) => {
    const me = (await userFromRequest(request))!;
    const { name } = await readBody(request, ProfileNameSchema);
    return accountJson({ user: await updateName(me.id, name) });
  },
  { guard: signedIn },
);
