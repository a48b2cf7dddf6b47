import {
  DeleteObjectCommand,
  GetObjectCommand,
  PutObjectCommand,
  S3Client,
  S3ServiceException,
} from "@aws-sdk/client-s3";
import { storageConfig } from "./config";
import { assertObjectKey } from "./keys";

/**
 * Object storage for evidence (lot photos): put, get and delete whole objects
 * in one bucket. The client is made on first use from the S3_* variables
 * (lib/storage/config.ts) and kept on globalThis, because the custom server
 * and Next's bundle load this module separately and should share one client.
 */
type Store = { client: S3Client; bucket: string };
const g = globalThis as unknown as { __getterlineObjectStore?: Store };

function store(): Store {
  if (g.__getterlineObjectStore) return g.__getterlineObjectStore;
  const c = storageConfig();
  const client = new S3Client({
    region: c.region,
    endpoint: c.endpoint,
    forcePathStyle: c.forcePathStyle,
    credentials: c.credentials,
    maxAttempts: 3,
  });
  g.__getterlineObjectStore = { client, bucket: c.bucket };
  return g.__getterlineObjectStore;
}

/** Forget the client so the next call reads the environment again (tests, shutdown). */
export function resetObjectStore(): void {
  g.__getterlineObjectStore?.client.destroy();
  g.__getterlineObjectStore = undefined;
}

/** The bucket in use. */
export function objectBucket(): string {
  return store().bucket;
}

/** Write (or overwrite) one object. */
export async function putObject(key: string, body: Buffer, contentType: string): Promise<void> {
  const { client, bucket } = store();
  await client.send(
    new PutObjectCommand({
      Bucket: bucket,
      Key: assertObjectKey(key),
      Body: body,
      ContentType: contentType,
      ContentLength: body.length,
    }),
  );
}

export type StoredObject = { body: Buffer; contentType: string; contentLength: number };

/** Read one object whole, or null when there is no such key. */
export async function getObject(key: string): Promise<StoredObject | null> {
  const { client, bucket } = store();
  try {
    const res = await client.send(new GetObjectCommand({ Bucket: bucket, Key: assertObjectKey(key) }));
    const body = Buffer.from(res.Body ? await res.Body.transformToByteArray() : new Uint8Array());
    return { body, contentType: res.ContentType ?? "application/octet-stream", contentLength: body.length };
  } catch (e) {
    if (isMissing(e)) return null;
    throw e;
  }
}

/** Delete one object; deleting a missing key is not an error (S3 answers 204 either way). */
export async function deleteObject(key: string): Promise<void> {
  const { client, bucket } = store();
  await client.send(new DeleteObjectCommand({ Bucket: bucket, Key: assertObjectKey(key) }));
}

function isMissing(e: unknown): boolean {
  if (e instanceof S3ServiceException) return e.name === "NoSuchKey" || e.$metadata.httpStatusCode === 404;
  return false;
}
