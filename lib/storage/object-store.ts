import {
  CreateBucketCommand,
  DeleteObjectCommand,
  GetObjectCommand,
  HeadBucketCommand,
  NoSuchKey,
  PutObjectCommand,
  S3Client,
  S3ServiceException,
  paginateListObjectsV2,
} from "@aws-sdk/client-s3";
import { env, type Env } from "@/lib/env";

// The S3-compatible object store that holds evidence photos: the real service in production,
// s3rver on loopback under npm start and npm test (lib/platform/fakes.ts). Only this file talks
// to the SDK, so the rest of the app sees put, get and list.

type StoreConfig = Pick<Env, "S3_ENDPOINT" | "S3_REGION" | "S3_BUCKET" | "S3_ACCESS_KEY_ID" | "S3_SECRET_ACCESS_KEY">;

const globalForStore = globalThis as unknown as {
  shuntbookS3?: { signature: string; client: S3Client };
  shuntbookBuckets?: Map<string, Promise<void>>;
};

function configSignature(c: StoreConfig): string {
  return [c.S3_ENDPOINT ?? "", c.S3_REGION, c.S3_ACCESS_KEY_ID, c.S3_SECRET_ACCESS_KEY].join("|");
}

/** One client per configuration (tests may point the store elsewhere), kept across dev reloads. */
function s3Client(config: StoreConfig = env()): S3Client {
  const signature = configSignature(config);
  if (globalForStore.shuntbookS3?.signature !== signature) {
    globalForStore.shuntbookS3?.client.destroy();
    const client = new S3Client({
      endpoint: config.S3_ENDPOINT,
      region: config.S3_REGION,
      credentials: { accessKeyId: config.S3_ACCESS_KEY_ID, secretAccessKey: config.S3_SECRET_ACCESS_KEY },
      // s3rver (and most self-hosted stores) know only path-style addresses: http://host/bucket/key
      forcePathStyle: true,
      // Since 3.729 the SDK adds CRC checksums with aws-chunked framing by default; s3rver stores
      // that framing inside the object instead of the bytes sent. Checksums only where an operation needs one.
      requestChecksumCalculation: "WHEN_REQUIRED",
      responseChecksumValidation: "WHEN_REQUIRED",
    });
    globalForStore.shuntbookS3 = { signature, client };
  }
  return globalForStore.shuntbookS3.client;
}

function isStatus(error: unknown, ...statuses: number[]): boolean {
  return error instanceof S3ServiceException && statuses.includes(error.$metadata.httpStatusCode ?? 0);
}

/**
 * Creates the bucket on first use when it is missing, once per process and bucket. The launcher
 * already asks s3rver for it, but a fresh store (or one wiped by hand) should just work.
 */
function ensureBucket(config: StoreConfig = env()): Promise<void> {
  const buckets = (globalForStore.shuntbookBuckets ??= new Map());
  const key = `${configSignature(config)}|${config.S3_BUCKET}`;
  let ready = buckets.get(key);
  if (!ready) {
    ready = createBucketIfMissing(config).catch((error) => {
      buckets.delete(key); // let the next request try again
      throw error;
    });
    buckets.set(key, ready);
  }
  return ready;
}

async function createBucketIfMissing(config: StoreConfig): Promise<void> {
  const client = s3Client(config);
  const Bucket = config.S3_BUCKET;
  try {
    await client.send(new HeadBucketCommand({ Bucket }));
    return;
  } catch (error) {
    if (!isStatus(error, 404)) throw error;
  }
  try {
    await client.send(new CreateBucketCommand({ Bucket }));
  } catch (error) {
    // another process created it between our HEAD and our PUT
    if (!isStatus(error, 409)) throw error;
  }
}

export async function putObject(key: string, body: Uint8Array, contentType: string, config: StoreConfig = env()): Promise<void> {
  await ensureBucket(config);
  await s3Client(config).send(
    new PutObjectCommand({ Bucket: config.S3_BUCKET, Key: key, Body: body, ContentType: contentType, ContentLength: body.byteLength }),
  );
}

export type StoredObject = { body: ReadableStream<Uint8Array>; contentType: string | undefined; contentLength: number | undefined };

/** The object as a web stream (for a Response body), or null when the key does not exist. */
export async function getObject(key: string, config: StoreConfig = env()): Promise<StoredObject | null> {
  await ensureBucket(config);
  try {
    const out = await s3Client(config).send(new GetObjectCommand({ Bucket: config.S3_BUCKET, Key: key }));
    if (!out.Body) return null;
    return { body: out.Body.transformToWebStream(), contentType: out.ContentType, contentLength: out.ContentLength };
  } catch (error) {
    if (error instanceof NoSuchKey || isStatus(error, 404)) return null;
    throw error;
  }
}

export async function getObjectBytes(key: string, config: StoreConfig = env()): Promise<Uint8Array | null> {
  const object = await getObject(key, config);
  return object ? new Uint8Array(await new Response(object.body).arrayBuffer()) : null;
}

/** Keys under a prefix (all pages). For tests and maintenance; requests never list. */
export async function listObjectKeys(prefix = "", config: StoreConfig = env()): Promise<string[]> {
  await ensureBucket(config);
  const keys: string[] = [];
  for await (const page of paginateListObjectsV2({ client: s3Client(config) }, { Bucket: config.S3_BUCKET, Prefix: prefix })) {
    for (const object of page.Contents ?? []) if (object.Key) keys.push(object.Key);
  }
  return keys;
}

/**
 * Removes an object. Only for undoing a put whose database row was never written: a photo that
 * has a row is soft-deleted and its object kept.
 */
export async function deleteOrphanObject(key: string, config: StoreConfig = env()): Promise<void> {
  await s3Client(config).send(new DeleteObjectCommand({ Bucket: config.S3_BUCKET, Key: key }));
}
