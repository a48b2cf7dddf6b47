import { z } from "zod";

/**
 * Object storage settings, validated once. The defaults reach the local fake
 * (server/s3-fake.ts); a hosted bucket is a configuration change only:
 * set S3_ENDPOINT="" for the provider's own endpoint (virtual-host style) or
 * its URL, and its keys, or empty keys to use the SDK's default credential chain.
 */
const StorageEnvSchema = z
  .object({
    S3_ENDPOINT: z.union([z.literal(""), z.url({ protocol: /^https?$/ })]).default("http://127.0.0.1:4569"),
    S3_REGION: z.string().min(1).default("us-east-1"),
    S3_BUCKET: z
      .string()
      .regex(/^[a-z0-9][a-z0-9.-]{1,61}[a-z0-9]$/, "S3_BUCKET must be a bucket name (3–63 of a-z, 0-9, '.', '-')")
      .default("getterline-evidence"),
    S3_ACCESS_KEY_ID: z.string().default("S3RVER"),
    S3_SECRET_ACCESS_KEY: z.string().default("S3RVER"),
  })
  .refine((e) => (e.S3_ACCESS_KEY_ID === "") === (e.S3_SECRET_ACCESS_KEY === ""), {
    message: "set both S3_ACCESS_KEY_ID and S3_SECRET_ACCESS_KEY, or neither",
    path: ["S3_SECRET_ACCESS_KEY"],
  });

export type StorageConfig = {
  /** Undefined means the provider's default endpoint. */
  endpoint: string | undefined;
  region: string;
  bucket: string;
  /** Path-style addressing (http://host/bucket/key), needed by the fake and most self-hosted stores. */
  forcePathStyle: boolean;
  /** Undefined means the SDK's default credential chain. */
  credentials: { accessKeyId: string; secretAccessKey: string } | undefined;
};

/** Read and check the S3_* variables; throws a readable error listing every bad one. */
export function storageConfig(source: Record<string, string | undefined> = process.env): StorageConfig {
  const parsed = StorageEnvSchema.safeParse(source);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join(".")}: ${i.message}`);
    throw new Error(`Invalid storage environment:\n${lines.join("\n")}`);
  }
  const e = parsed.data;
  const endpoint = e.S3_ENDPOINT === "" ? undefined : e.S3_ENDPOINT;
  return {
    endpoint,
    region: e.S3_REGION,
    bucket: e.S3_BUCKET,
    forcePathStyle: endpoint !== undefined,
    credentials: e.S3_ACCESS_KEY_ID
      ? { accessKeyId: e.S3_ACCESS_KEY_ID, secretAccessKey: e.S3_SECRET_ACCESS_KEY }
      : undefined,
  };
}
