import { mkdirSync } from "node:fs";
import path from "node:path";
import { spawnGroup, stopGroup } from "./child-process";
import type { Lifecycle } from "./lifecycle";
import { log } from "./log";
import { waitForHttp } from "./wait-for-http";

// Local stand-ins for the hosted services, on loopback only: an SMTP catcher with a web inbox for
// outgoing mail, and an S3-compatible store for evidence photos. The app reaches them through the
// same SDKs it would use against the real services (nodemailer, @aws-sdk/client-s3).

type MailCatcher = { smtpUrl: string; inboxUrl: string };
type ObjectStore = { endpoint: string };
/** The key pair the S3 fake accepts (and nothing else). */
export type ObjectStoreKeys = { accessKeyId: string; secretAccessKey: string };

/** A key pair for the S3 fake: the secret from `secret` (persistent or random), a fixed-looking key id. */
export function objectStoreKeys(secret: string): ObjectStoreKeys {
  return { accessKeyId: "SHUNTBOOKLOCAL", secretAccessKey: secret };
}

function nodeBin(root: string, relative: string): string {
  return path.join(root, "node_modules", relative);
}

async function startMailCatcher(root: string, opts: { smtpPort: number; webPort: number; mailDir: string; lifecycle: Lifecycle }): Promise<MailCatcher> {
  mkdirSync(opts.mailDir, { recursive: true });
  const child = spawnGroup(
    process.execPath,
    [
      nodeBin(root, "maildev/dist/bin/maildev.js"),
      "--ip",
      "127.0.0.1",
      "--web-ip",
      "127.0.0.1",
      "--smtp",
      String(opts.smtpPort),
      "--web",
      String(opts.webPort),
      "--mail-directory",
      opts.mailDir,
      "--silent",
    ],
    // maildev warns that some of its dependencies prefer Node 22; it works on 20, where our tests run it
    { cwd: root, stdio: ["ignore", "ignore", "ignore"] },
  );
  opts.lifecycle.onStop("the mail catcher", () => stopGroup(child));
  const inboxUrl = `http://127.0.0.1:${opts.webPort}`;
  await waitForHttp(`${inboxUrl}/api/email`, 30_000);
  log(`mail catcher: SMTP 127.0.0.1:${opts.smtpPort}, inbox ${inboxUrl}`);
  return { smtpUrl: `smtp://127.0.0.1:${opts.smtpPort}`, inboxUrl };
}

/**
 * s3rver behind lib/platform/s3-fake.cjs, which refuses every request not signed with this run's
 * key pair: the bucket is private, as a real one is.
 */
async function startObjectStore(
  root: string,
  opts: { port: number; dataDir: string; bucket: string; keys: ObjectStoreKeys; lifecycle: Lifecycle },
): Promise<ObjectStore> {
  mkdirSync(opts.dataDir, { recursive: true });
  const child = spawnGroup(process.execPath, [path.join(root, "lib/platform/s3-fake.cjs"), "127.0.0.1", String(opts.port), opts.dataDir, opts.bucket], {
    cwd: root,
    stdio: ["ignore", "ignore", "inherit"],
    env: { ...process.env, S3_FAKE_ACCESS_KEY_ID: opts.keys.accessKeyId, S3_FAKE_SECRET_ACCESS_KEY: opts.keys.secretAccessKey },
  });
  opts.lifecycle.onStop("the object store", () => stopGroup(child));
  const endpoint = `http://127.0.0.1:${opts.port}`;
  await waitForHttp(endpoint, 30_000);
  log(`object store (S3 fake, private bucket ${opts.bucket}): ${endpoint}`);
  return { endpoint };
}

/**
 * Starts whichever fakes the environment does not replace with a real service, and returns the
 * variables the app needs to reach them.
 */
export async function startFakes(
  root: string,
  lifecycle: Lifecycle,
  opts: {
    stateDir: string;
    smtpPort: number;
    webPort: number;
    s3Port: number;
    bucket: string;
    /** The S3 fake's key pair: kept in the data folder by npm start, fresh per run in npm test. */
    s3Keys: ObjectStoreKeys;
    /** Variables that may already name real services (then no fake is started). */
    env: Partial<Record<"SMTP_URL" | "S3_ENDPOINT", string | undefined>>;
  },
): Promise<Record<string, string>> {
  const out: Record<string, string> = {};
  if (!opts.env.SMTP_URL) {
    const mail = await startMailCatcher(root, {
      smtpPort: opts.smtpPort,
      webPort: opts.webPort,
      mailDir: path.join(opts.stateDir, "mail"),
      lifecycle,
    });
    out.SMTP_URL = mail.smtpUrl;
    out.MAIL_INBOX_URL = mail.inboxUrl;
  }
  if (!opts.env.S3_ENDPOINT) {
    const store = await startObjectStore(root, {
      port: opts.s3Port,
      dataDir: path.join(opts.stateDir, "s3"),
      bucket: opts.bucket,
      keys: opts.s3Keys,
      lifecycle,
    });
    out.S3_ENDPOINT = store.endpoint;
    out.S3_ACCESS_KEY_ID = opts.s3Keys.accessKeyId;
    out.S3_SECRET_ACCESS_KEY = opts.s3Keys.secretAccessKey;
  }
  return out;
}
