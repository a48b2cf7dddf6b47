// Test-side helper for object storage: the local S3 fake (server/s3-fake.ts)
// in this process, on a free port with a temporary data directory, and the
// app's storage client pointed at it through the S3_* variables.
import { mkdtemp, rm } from "node:fs/promises";
import os from "node:os";
import path from "node:path";
import { resetObjectStore } from "../../lib/storage/objects";
import { startS3Fake } from "../../server/s3-fake";

export type TestS3 = { url: string; bucket: string; dir: string; stop(): Promise<void> };

/**
 * Start the fake and point lib/storage at it. Call in beforeAll; call stop()
 * in afterAll, which closes the server, deletes its directory and drops the client.
 */
export async function startTestS3(bucket = "getterline-evidence-test"): Promise<TestS3> {
  const dir = await mkdtemp(path.join(os.tmpdir(), "getterline-s3-"));
  const fake = await startS3Fake({ port: 0, dir, bucket, resetOnClose: true });
  Object.assign(process.env, {
    S3_ENDPOINT: fake.url,
    S3_BUCKET: bucket,
    S3_REGION: "us-east-1",
    S3_ACCESS_KEY_ID: "S3RVER",
    S3_SECRET_ACCESS_KEY: "S3RVER",
  });
  resetObjectStore();
  return {
    url: fake.url,
    bucket,
    dir,
    async stop() {
      resetObjectStore();
      await fake.close();
      await rm(dir, { recursive: true, force: true });
    },
  };
}
