import { route, routes } from "@/lib/http";

// GET /api/v1/health: answers while the process serves requests, and touches nothing else (no
// database), so a load balancer's probe cannot pile work onto a struggling database. Being the
// emptiest handler the app has, it is also the framework's ceiling in `npm run benchmark:lookup`.
// no-store: a cached "ok" would hide an instance that has stopped answering.
export const dynamic = "force-dynamic";

export const { GET, POST, PUT, PATCH, DELETE } = routes({
  GET: route({ auth: "public" }, async () => Response.json({ ok: true }, { headers: { "Cache-Control": "no-store" } })),
});
