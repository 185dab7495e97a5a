// The browser security headers every response carries (issue 12, item 6). next.config.mjs sets
// the fixed ones on every response (./static-security-headers.mjs); pages also get a fresh script nonce per request, which
// Next.js reads back from the request's Content-Security-Policy header and puts on its own
// scripts (Next.js 16 docs, guides/content-security-policy: "Adding a nonce with Proxy").
// Sources: MDN, Content-Security-Policy, X-Content-Type-Options, Referrer-Policy,
// Permissions-Policy; CSP Level 3 ('strict-dynamic', frame-ancestors).

/** A fresh nonce: 16 random bytes, base64 (CSP's nonce-source grammar). */
export function newNonce(): string {
  return Buffer.from(crypto.getRandomValues(new Uint8Array(16))).toString("base64");
}

type PolicyOptions = {
  nonce: string;
  /** `next dev`: React's dev build rebuilds error stacks with eval (Next.js docs: not needed in production). */
  development: boolean;
  /** Served over https (NEXTAUTH_URL): sub-resources are upgraded; never on http://127.0.0.1, where nothing answers https. */
  https: boolean;
};

/**
 * The policy of an HTML page. Scripts: only those carrying this response's nonce, and what they
 * load ('strict-dynamic'), so an injected <script> or on*-attribute never runs. Styles allow
 * inline because React writes `style` attributes (chart positions), which cannot carry a nonce;
 * a style cannot run code. Nothing may frame a page (clickjacking of the admin page, finding 7).
 */
export function pagePolicy(o: PolicyOptions): string {
  const directives = [
    "default-src 'self'",
    `script-src 'self' 'nonce-${o.nonce}' 'strict-dynamic'${o.development ? " 'unsafe-eval'" : ""}`,
    "style-src 'self' 'unsafe-inline'",
    "img-src 'self' blob: data:",
    "font-src 'self'",
    "connect-src 'self'",
    "object-src 'none'",
    "base-uri 'none'",
    "form-action 'self'",
    "frame-ancestors 'none'",
    ...(o.https ? ["upgrade-insecure-requests"] : []),
  ];
  return directives.join("; ");
}

export { RESOURCE_POLICY } from "./static-security-headers.mjs";
