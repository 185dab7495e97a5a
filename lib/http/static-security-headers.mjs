// The security headers that never change per request, in plain JavaScript so that next.config.mjs
// (which cannot import TypeScript) and lib/http/security-headers.ts share one definition.
// next.config.mjs's headers() puts them on every response, API routes and static files included;
// proxy.ts adds the per-request page policy. Sources: MDN, X-Content-Type-Options,
// Referrer-Policy, Permissions-Policy, Cross-Origin-Opener-Policy; CSP Level 3 (frame-ancestors).

/** @type {Readonly<Record<string, string>>} */
export const STATIC_SECURITY_HEADERS = {
  "X-Content-Type-Options": "nosniff",
  // for browsers without CSP frame-ancestors; same meaning
  "X-Frame-Options": "DENY",
  // reset and sign-in links carry tokens in their address: never send the address to another site
  "Referrer-Policy": "same-origin",
  // Shuntbook uses none of these; file inputs (photo uploads) need no camera permission
  "Permissions-Policy": "camera=(), microphone=(), geolocation=(), payment=(), usb=(), serial=(), bluetooth=(), midi=(), browsing-topics=()",
  "Cross-Origin-Opener-Policy": "same-origin",
};

/** JSON, images and files: nothing in them may run or be framed. */
export const RESOURCE_POLICY = "default-src 'none'; frame-ancestors 'none'; base-uri 'none'; form-action 'none'";
