import { z } from "zod";

/**
 * Every environment variable the app reads, validated once. Defaults suit the
 * private loopback services our scripts start; production sets them all.
 */
const EnvSchema = z.object({
  NODE_ENV: z.enum(["development", "production", "test"]).default("development"),
  DATABASE_URL: z.string().default("postgres://app@127.0.0.1:54329/getterline"),
  NEXTAUTH_SECRET: z.string().min(16, "NEXTAUTH_SECRET must be set (scripts/ensure-env.sh writes one)"),
  NEXTAUTH_URL: z.string().default("http://localhost:3000"),
  PORT: z.coerce.number().int().positive().default(3000),
  HOST: z.string().default("0.0.0.0"),
  SMTP_HOST: z.string().default("127.0.0.1"),
  SMTP_PORT: z.coerce.number().int().positive().default(1025),
  MAIL_FROM: z.string().default("Getterline Exchange <desk@getterline.test>"),
  MAIL_CATCHER_URL: z.string().default("http://127.0.0.1:1080"),
  /** Extra origins allowed to call cookie-authenticated API routes (comma-separated). */
  TRUSTED_ORIGINS: z.string().default(""),
  DB_POOL_MAX: z.coerce.number().int().positive().default(10),
  LOG_SQL: z.enum(["0", "1"]).default("0"),
});

export type Env = z.infer<typeof EnvSchema>;

let cached: Env | undefined;

/** The validated environment; throws a readable error listing every bad variable. */
export function env(): Env {
  if (cached) return cached;
  const parsed = EnvSchema.safeParse(process.env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join(".")}: ${i.message}`);
    throw new Error(`Invalid environment:\n${lines.join("\n")}`);
  }
  cached = parsed.data;
  return cached;
}
