// The local S3 fake (s3rver) behind a door: s3rver itself answers every request, signed or not, and
// checks no Signature Version 4 at all, so anyone on the machine could list the bucket and read
// every evidence photo. This process serves s3rver's handler only to requests signed (SigV4,
// Authorization header) with the one key pair it is started with; everything else gets S3's own
// 403 AccessDenied. The app holds the key and serves photos through its own access checks.
//
// Usage: node lib/platform/s3-fake.cjs <address> <port> <directory> <bucket>
// with S3_FAKE_ACCESS_KEY_ID and S3_FAKE_SECRET_ACCESS_KEY in the environment.
//
// Source for the signature: AWS, "Signature Version 4 signing process" / "Authenticating
// Requests: Using the Authorization Header" (S3 API reference): canonical request, string to
// sign, signing key HMAC chain. The payload hash is taken from x-amz-content-sha256 as signed;
// the body is not re-hashed (a fake on loopback; the signature already binds the header).
"use strict";
/* eslint-disable @typescript-eslint/no-require-imports -- a plain Node script started by path, CommonJS like peer-address.cjs */

const { createHash, createHmac, timingSafeEqual } = require("node:crypto");
const http = require("node:http");
const S3rver = require("s3rver");

const [address, port, directory, bucket] = process.argv.slice(2);
const accessKeyId = process.env.S3_FAKE_ACCESS_KEY_ID;
const secretAccessKey = process.env.S3_FAKE_SECRET_ACCESS_KEY;
if (!address || !port || !directory || !bucket || !accessKeyId || !secretAccessKey) {
  console.error("usage: s3-fake.cjs <address> <port> <directory> <bucket>, with S3_FAKE_ACCESS_KEY_ID and S3_FAKE_SECRET_ACCESS_KEY set");
  process.exit(2);
}

const MAX_CLOCK_SKEW_MS = 15 * 60 * 1000; // S3 refuses requests more than 15 minutes off (RequestTimeTooSkewed)

const sha256 = (data) => createHash("sha256").update(data).digest("hex");
const hmac = (key, data) => createHmac("sha256", key).update(data).digest();
// RFC 3986 unreserved characters stay, everything else is %XX (AWS's UriEncode)
const uriEncode = (s) => encodeURIComponent(s).replace(/[!'()*]/g, (c) => `%${c.charCodeAt(0).toString(16).toUpperCase()}`);

function canonicalQuery(rawQuery) {
  if (!rawQuery) return "";
  const pairs = rawQuery
    .split("&")
    .filter(Boolean)
    .map((part) => {
      const eq = part.indexOf("=");
      const [k, v] = eq < 0 ? [part, ""] : [part.slice(0, eq), part.slice(eq + 1)];
      return [uriEncode(decodeURIComponent(k)), uriEncode(decodeURIComponent(v))];
    });
  pairs.sort(([ka, va], [kb, vb]) => (ka < kb ? -1 : ka > kb ? 1 : va < vb ? -1 : va > vb ? 1 : 0));
  return pairs.map(([k, v]) => `${k}=${v}`).join("&");
}

/** Why the request is refused, or null when it carries a valid signature by our key. */
function refusal(req) {
  const auth = req.headers.authorization;
  if (!auth) return "anonymous access is not allowed";
  const m = /^AWS4-HMAC-SHA256 Credential=([^/]+)\/(\d{8})\/([^/]+)\/([^/]+)\/aws4_request, ?SignedHeaders=([a-z0-9;-]+), ?Signature=([0-9a-f]{64})$/.exec(
    auth,
  );
  if (!m) return "only Signature Version 4 in the Authorization header is accepted";
  const [, keyId, date, region, service, signedHeaders, signature] = m;
  if (keyId !== accessKeyId) return "unknown access key";
  const amzDate = req.headers["x-amz-date"];
  const payloadHash = req.headers["x-amz-content-sha256"];
  if (typeof amzDate !== "string" || !amzDate.startsWith(date) || typeof payloadHash !== "string") return "x-amz-date and x-amz-content-sha256 are required";
  const when = Date.parse(amzDate.replace(/^(\d{4})(\d{2})(\d{2})T(\d{2})(\d{2})(\d{2})Z$/, "$1-$2-$3T$4:$5:$6Z"));
  if (!Number.isFinite(when) || Math.abs(Date.now() - when) > MAX_CLOCK_SKEW_MS) return "request time too skewed";
  const names = signedHeaders.split(";");
  if (!names.includes("host")) return "host must be signed";
  const [rawPath, rawQuery = ""] = req.url.split(/\?(.*)/s);
  const headers = names
    .map(
      (name) =>
        `${name}:${String(req.headers[name] ?? "")
          .trim()
          .replace(/\s+/g, " ")}\n`,
    )
    .join("");
  const canonicalRequest = [req.method, rawPath, canonicalQuery(rawQuery), headers, signedHeaders, payloadHash].join("\n");
  const scope = `${date}/${region}/${service}/aws4_request`;
  const stringToSign = ["AWS4-HMAC-SHA256", amzDate, scope, sha256(canonicalRequest)].join("\n");
  const key = hmac(hmac(hmac(hmac(`AWS4${secretAccessKey}`, date), region), service), "aws4_request");
  const expected = hmac(key, stringToSign);
  const given = Buffer.from(signature, "hex");
  return given.length === expected.length && timingSafeEqual(given, expected) ? null : "signature does not match";
}

function deny(res, message) {
  const body = `<?xml version="1.0" encoding="UTF-8"?>\n<Error><Code>AccessDenied</Code><Message>Access Denied (${message})</Message></Error>`;
  res.writeHead(403, { "Content-Type": "application/xml", "Content-Length": Buffer.byteLength(body) });
  res.end(body);
}

async function main() {
  const s3rver = new S3rver({ directory, silent: true, configureBuckets: [{ name: bucket }] });
  await s3rver.configureBuckets();
  const handle = s3rver.callback();
  const server = http.createServer((req, res) => {
    const why = refusal(req);
    if (why) return deny(res, why);
    // s3rver would look the key up in its own fixed account; the signature is checked here already
    delete req.headers.authorization;
    handle(req, res);
  });
  server.listen(Number(port), address);
  for (const signal of ["SIGINT", "SIGTERM"]) process.on(signal, () => server.close(() => process.exit(0)));
}

main().catch((error) => {
  console.error("[s3 fake]", error);
  process.exit(1);
});
