import { notFound } from "@/lib/api/errors";
import { apiRoute, readOnly } from "@/lib/api/handler";
import { getUserSummary, updateUser } from "@/lib/moderation";
import { adminOnly, privateJson, readJsonBody, requestUser } from "@/lib/moderation/http";

type Context = { params: Promise<{ id: string }> };

// GET /api/v1/admin/users/{id}: one person's role, trust and record. Admins only.
export const GET = apiRoute<Context>(
  async (_request, { params }) => {
    const { id } = await params;
    const user = await getUserSummary(id);
    if (!user) throw notFound(`There is no user with id ${id}.`, "id");
    return privateJson({ user });
  },
  { guard: adminOnly },
);

// PATCH /api/v1/admin/users/{id} with { role?, trusted?, reason? }: audited ('user_update'); the
// role applies on the person's next request. 409 when it would leave the site without an admin.
export const PATCH = apiRoute<Context>(
  async (request, { params }) => {
    const actor = await requestUser(request);
    return privateJson(await updateUser(actor, (await params).id, await readJsonBody(request)));
  },
  { guard: adminOnly },
);

const allowed = readOnly(["GET", "PATCH"]);
export const POST = allowed;
export const PUT = allowed;
export const DELETE = allowed;
