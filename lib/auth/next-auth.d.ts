import type { Role } from "@/lib/vocabulary";

// What Shuntbook adds to next-auth's types: the role and the user id on the session, the role
// on the user the adapter and the credentials provider return, and our claims in the JWT.
declare module "next-auth" {
  interface Session {
    user: { id: string; name: string; email: string; role: Role };
  }
  interface User {
    role?: Role;
  }
}

declare module "next-auth/jwt" {
  interface JWT {
    role?: Role;
    /** Epoch ms of the sign-in this session came from (see lib/auth/guard.ts). */
    authTime?: number;
    /** users.session_version when this session began; a sign-out moves the user's on (lib/auth/sessions.ts). */
    sessionVersion?: number;
    sid?: string;
  }
}
