import type { NextAuthOptions } from "next-auth";
import CredentialsProvider from "next-auth/providers/credentials";
import EmailProvider from "next-auth/providers/email";
import { env } from "@/lib/env";
import { sendMail } from "@/lib/mail/send";
import { magicLinkMail } from "@/lib/mail/templates";
import { smtpUrl } from "@/lib/mail/transport";
import { authenticate } from "./accounts";
import { shuntbookAdapter } from "./adapter";
import { isOwnCallbackUrl } from "./next-auth-input";
import { SignInSchema } from "./schemas";
import { currentSessionVersion, endSession, liveSessionUser, newSessionId } from "./sessions";
import { authSecret, SESSION_MAX_AGE_SECONDS } from "./session-cookie";

// next-auth's configuration: two ways in (a magic link by e-mail, or e-mail and password), one
// session kind (an encrypted JWT cookie: credentials sign-in requires it, and it lets the guard
// work without a session table). The JWT names the user (sub) and when they signed in (authTime);
// the guard (./guard.ts) reads role and password-change time fresh from the database.

const MAGIC_LINK_MINUTES = 15;

/** Built on demand, not at import time, so that `next build` needs no database or secret. */
export function authOptions(): NextAuthOptions {
  return {
    secret: authSecret(),
    adapter: shuntbookAdapter(),
    session: { strategy: "jwt", maxAge: SESSION_MAX_AGE_SECONDS },
    pages: { signIn: "/signin", verifyRequest: "/signin/check-email", error: "/signin" },
    providers: [
      EmailProvider({
        server: smtpUrl(),
        from: env().MAIL_FROM,
        maxAge: MAGIC_LINK_MINUTES * 60,
        // sent right away, not through the queue: the person is waiting at the sign-in page, and
        // a failure must show there instead of being retried behind their back
        sendVerificationRequest: async ({ identifier, url }) => {
          await sendMail({ to: identifier, ...magicLinkMail({ url, minutes: MAGIC_LINK_MINUTES }) });
        },
      }),
      CredentialsProvider({
        id: "credentials",
        name: "E-mail and password",
        credentials: { email: { label: "E-mail", type: "email" }, password: { label: "Password", type: "password" } },
        // rate limiting happens in front of this, in the route (./route-limits.ts)
        authorize: async (credentials) => {
          const parsed = SignInSchema.safeParse(credentials ?? {});
          if (!parsed.success) return null;
          return authenticate(parsed.data.email, parsed.data.password);
        },
      }),
    ],
    events: {
      // ends this session on the server, every copy of its cookie included (./sessions.ts)
      async signOut({ token }) {
        if (token?.sub)
          await endSession(token.sid, token.sub, new Date(typeof token.exp === "number" ? token.exp * 1000 : Date.now() + SESSION_MAX_AGE_SECONDS * 1000));
      },
    },
    callbacks: {
      async jwt({ token, user }) {
        // `user` is there only at sign-in (from the adapter or from authorize)
        if (user) {
          token.sub = user.id;
          token.name = user.name ?? token.name;
          token.email = user.email ?? token.email;
          token.role = user.role ?? "contributor";
          token.authTime = Date.now();
          token.sessionVersion = await currentSessionVersion(user.id);
          token.sid = newSessionId();
        } else if (!(await liveSessionUser(token))) {
          // next-auth's session endpoint: a session the guard would refuse is refused here too; a throw
          // makes next-auth answer "no session" and delete the cookie (core/routes/session.js)
          throw new Error("this session was ended by a sign-out");
        }
        return token;
      },
      // next-auth's default throws on a callback URL that does not parse (a 500); only our own pages
      async redirect({ url, baseUrl }) {
        if (!isOwnCallbackUrl(url)) return baseUrl;
        return url.startsWith("/") ? `${baseUrl}${url}` : url;
      },
      async session({ session, token }) {
        session.user = {
          id: token.sub ?? "",
          name: token.name ?? "",
          email: token.email ?? "",
          role: token.role ?? "contributor",
        };
        return session;
      },
    },
  };
}
