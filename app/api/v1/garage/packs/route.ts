import { privateJson, route, routes } from "@/lib/http";
import { createPack, listPacks } from "@/lib/garage/packs";

// The caller's own packs, each with its charge log and suggested OSD warnings.
export const { GET, POST, PUT, PATCH, DELETE } = routes({
  GET: route({ auth: "user" }, async ({ user }) => privateJson({ packs: await listPacks(user.id) })),
  POST: route({ auth: "user", body: "json" }, async ({ user, body }) => privateJson({ pack: await createPack(user.id, body) }, 201)),
});
