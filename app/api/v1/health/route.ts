import { readOnly } from "@/lib/api/handler";

// GET /api/v1/health: answers while the process serves requests, and touches nothing else (no
// database), so a load balancer's probe cannot pile work onto a struggling database. Being the
// emptiest handler the app has, it is also the framework's ceiling in `npm run benchmark:lookup`.
// no-store: a cached "ok" would hide an instance that has stopped answering.
export const dynamic = "force-dynamic";

const HEADERS = { "Cache-Control": "no-store" } as const;

export function GET(): Response {
  return Response.json({ ok: true }, { headers: HEADERS });
}

export const POST = readOnly();
export const PUT = readOnly();
export const PATCH = readOnly();
export const DELETE = readOnly();
