import { randomBytes } from "node:crypto";
import { GetObjectCommand, S3Client } from "@aws-sdk/client-s3";
import pg from "pg";
import { describe, expect, it } from "vitest";
import { env } from "@/lib/env";
import { getObjectBytes, putObject } from "@/lib/storage/object-store";
import { setupTestDatabase } from "@/tests/support/database";
import { setupOwnBucket } from "./photos-support";

// Issue 12, finding 8 / deliver 7: npm test's throwaway cluster and S3 fake are made the same way
// as npm start's (lib/platform/postgres-cluster.ts, lib/platform/fakes.ts), so what holds here
// holds for .data too.

const database = setupTestDatabase("migrated");
setupOwnBucket();

async function connect(url: string): Promise<pg.Client> {
  const client = new pg.Client({ connectionString: url, connectionTimeoutMillis: 10_000 });
  try {
    await client.connect();
  } catch (error) {
    // a refusal by pg itself (no password for the SCRAM challenge) leaves the socket open, and the
    // server's half-authenticated backend would hold the test database for authentication_timeout
    await client.end().catch(() => undefined);
    throw error;
  }
  return client;
}

function withCredentials(url: string, user: string, password: string | undefined): string {
  const u = new URL(url);
  u.username = user;
  u.password = password ?? "";
  return u.toString();
}

describe("the embedded PostgreSQL cluster", () => {
  it("refuses a connection without a password, or with a wrong one, for the app's role and the superuser", async () => {
    const url = database.url();
    for (const user of [new URL(url).username, "shuntbook"]) {
      // no password: pg refuses to answer the SCRAM challenge; an empty one is refused by the server
      await expect(connect(withCredentials(url, user, undefined))).rejects.toThrow();
      await expect(connect(withCredentials(url, user, "not-the-password"))).rejects.toThrow(/password authentication failed/);
    }
  });

  it("the app connects as a role that is no superuser, cannot replicate, and owns its database and tables", async () => {
    const client = await connect(database.url());
    try {
      const { rows } = await client.query<{ rolsuper: boolean; rolreplication: boolean; rolcreaterole: boolean; owner: string; me: string }>(
        `SELECT r.rolsuper, r.rolreplication, r.rolcreaterole, pg_get_userbyid(d.datdba) AS owner, current_user AS me
         FROM pg_roles r, pg_database d WHERE r.rolname = current_user AND d.datname = current_database()`,
      );
      expect(rows[0]).toMatchObject({ rolsuper: false, rolreplication: false, rolcreaterole: false });
      expect(rows[0].owner).toBe(rows[0].me);
      // the migrations ran as the owner: every table of ours, and pg-boss's, belongs to it
      const others = await client.query("SELECT tablename FROM pg_tables WHERE schemaname IN ('public', 'pgboss') AND tableowner <> current_user");
      expect(others.rows).toEqual([]);
      await expect(client.query("SELECT pg_read_file('pg_hba.conf')")).rejects.toThrow(/permission denied/);
    } finally {
      await client.end();
    }
  });
});

describe("the S3 fake's bucket is private", () => {
  const key = `evidence/${randomBytes(6).toString("hex")}.jpg`;
  const objectUrl = () => `${env().S3_ENDPOINT}/${env().S3_BUCKET}/${key}`;

  it("the app, with its key, writes and reads a photo", async () => {
    await putObject(key, new Uint8Array([0xff, 0xd8, 0xff, 0xd9]), "image/jpeg");
    expect(await getObjectBytes(key)).toEqual(new Uint8Array([0xff, 0xd8, 0xff, 0xd9]));
  });

  it("an anonymous GET of that photo's key, or a listing of the bucket, is 403", async () => {
    const get = await fetch(objectUrl());
    expect(get.status).toBe(403);
    expect(await get.text()).toMatch(/AccessDenied/);
    const list = await fetch(`${env().S3_ENDPOINT}/${env().S3_BUCKET}?list-type=2`);
    expect(list.status).toBe(403);
    expect((await fetch(`${env().S3_ENDPOINT}/`)).status).toBe(403);
  });

  it("a request signed with the right key id but a wrong secret is 403 too", async () => {
    const e = env();
    const forger = new S3Client({
      endpoint: e.S3_ENDPOINT,
      region: e.S3_REGION,
      forcePathStyle: true,
      credentials: { accessKeyId: e.S3_ACCESS_KEY_ID, secretAccessKey: "guessed-secret-guessed-secret" },
    });
    try {
      await expect(forger.send(new GetObjectCommand({ Bucket: e.S3_BUCKET, Key: key }))).rejects.toMatchObject({ $metadata: { httpStatusCode: 403 } });
    } finally {
      forger.destroy();
    }
  });
});
