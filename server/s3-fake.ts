// Local S3 stand-in for development, demo and tests: s3rver on a loopback port,
// objects kept on disk, the evidence bucket made on start. Path-style only.
//   node --import tsx server/s3-fake.ts
//   S3_FAKE_PORT (4569)  S3_FAKE_DIR (.data/s3)  S3_BUCKET (getterline-evidence)
// Credentials are s3rver's fixed pair: S3RVER / S3RVER.
import { mkdirSync } from "node:fs";
import type { AddressInfo } from "node:net";
import { createRequire } from "node:module";
import path from "node:path";
import { pathToFileURL } from "node:url";

/** The part of s3rver's class we use (the package ships no types). */
type S3rverInstance = { run(): Promise<AddressInfo>; close(): Promise<void> };
type S3rverOptions = {
  address: string;
  port: number;
  directory: string;
  silent: boolean;
  vhostBuckets: boolean;
  resetOnClose: boolean;
  configureBuckets: Array<{ name: string }>;
};
const S3rver = createRequire(import.meta.url)("s3rver") as new (o: S3rverOptions) => S3rverInstance;

export type S3FakeOptions = {
  /** 0 picks a free port. */
  port?: number;
  /** Data directory; created when missing. */
  dir?: string;
  bucket?: string;
  /** Remove every object when closed (tests). */
  resetOnClose?: boolean;
};

export type S3Fake = { url: string; port: number; bucket: string; close(): Promise<void> };

/** Start s3rver on 127.0.0.1 with the bucket made; resolves once it listens. */
export async function startS3Fake(opts: S3FakeOptions = {}): Promise<S3Fake> {
  const dir = path.resolve(opts.dir ?? ".data/s3");
  const bucket = opts.bucket ?? "getterline-evidence";
  mkdirSync(dir, { recursive: true });
  const server = new S3rver({
    address: "127.0.0.1",
    port: opts.port ?? 4569,
    directory: dir,
    silent: true,
    // Requests come as http://127.0.0.1:port/<bucket>/<key>; never read a bucket from the Host header.
    vhostBuckets: false,
    resetOnClose: opts.resetOnClose ?? false,
    configureBuckets: [{ name: bucket }],
  });
  const address = await server.run();
  let closed = false;
  return {
    url: `http://127.0.0.1:${address.port}`,
    port: address.port,
    bucket,
    async close() {
      if (closed) return;
      closed = true;
      await server.close();
    },
  };
}

async function main(): Promise<void> {
  const fake = await startS3Fake({
    port: Number(process.env.S3_FAKE_PORT ?? 4569),
    dir: process.env.S3_FAKE_DIR ?? ".data/s3",
    bucket: process.env.S3_BUCKET ?? "getterline-evidence",
  });
  console.log(`s3-fake: ${fake.url} bucket ${fake.bucket} (pid ${process.pid})`);
  const stop = (signal: string) => {
    console.log(`s3-fake: ${signal} received, stopping`);
    setTimeout(() => process.exit(1), 5_000).unref();
    fake.close().then(
      () => process.exit(0),
      () => process.exit(1),
    );
  };
  process.once("SIGTERM", () => stop("SIGTERM"));
  process.once("SIGINT", () => stop("SIGINT"));
}

// Run only as a script, not when a test imports startS3Fake.
if (process.argv[1] && import.meta.url === pathToFileURL(path.resolve(process.argv[1])).href) {
  main().catch((e: Error) => {
    console.error(`s3-fake: ${e.message}`);
    process.exit(1);
  });
}
