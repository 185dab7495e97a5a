import NextAuth from "next-auth";
import type { NextRequest } from "next/server";
import { checkNextAuthRequest } from "@/lib/auth/next-auth-input";
import { authOptions } from "@/lib/auth/options";
import { limitAuthRequest } from "@/lib/auth/route-limits";
import { routes } from "@/lib/http";
import { toApiError } from "@/lib/http/errors";
import { errorResponse } from "@/lib/http/respond";

// next-auth's endpoints (/api/auth/signin, callback, session, csrf, signout, …), with the input
// check and the sign-in rate limits in front. Our own account endpoints are static routes beside
// this one (/api/auth/sign-up, password-reset, profile), which Next.js matches before this catch-all.
export const dynamic = "force-dynamic";

type Context = { params: Promise<{ nextauth: string[] }> };

async function handle(incoming: NextRequest, context: Context): Promise<Response> {
  try {
    const { nextauth = [] } = await context.params;
    const { request, form } = await checkNextAuthRequest(incoming);
    const limit = await limitAuthRequest(request, nextauth, form);
    if (limit.blocked) return limit.blocked;
    const response: Response = await NextAuth(request, context, authOptions());
    await limit.afterwards(response);
    return response;
  } catch (error) {
    return errorResponse(toApiError(error, incoming));
  }
}

// next-auth answers GET and POST itself; the other methods get the API's JSON 405.
export const { GET, POST, PUT, PATCH, DELETE } = routes({ GET: handle, POST: handle });
