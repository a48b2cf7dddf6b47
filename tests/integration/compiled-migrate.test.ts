// The compiled database CLI (scripts/build-migrate.mjs → migrate.js, migrations/*.js, seeders/*.js) migrates and
// seeds with plain node, records exactly the names the tsx path records, and each path continues the other's work.
import { spawn } from "node:child_process";
import { readdirSync, readFileSync } from "node:fs";
import { rm } from "node:fs/promises";
import os from "node:os";
import path from "node:path";
import pg from "pg";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import pkg from "../../package.json";

const ROOT = path.resolve(__dirname, "../..");
// A build of this run's own, inside the project (so the bundles find node_modules) and apart from dist/.
const OUT = path.join(ROOT, ".data", `migrate-build-${process.pid}-${Date.now()}`);
const SCRATCH = `getterline_prodmig_${process.pid}_${Date.now()}`;

const withDatabase = (url: string, name: string) => {
  const u = new URL(url);
  u.pathname = `/${name}`;
  return u.toString();
};
const runUrl = inject("databaseUrl");
const scratchUrl = withDatabase(runUrl, SCRATCH);

/** What the tsx path records for a folder: each source file's name, `.ts` included (lib/db/migrator.ts). */
const sourceNames = (folder: string) =>
  readdirSync(path.join(ROOT, folder))
    .filter((f) => f.endsWith(".ts"))
    .sort();

type Run = { code: number | null; stdout: string; stderr: string };

/** Run node with `args` to its end, from a working directory outside the project unless told otherwise. */
function node(args: string[], opts: { cwd?: string; env?: Record<string, string> } = {}): Promise<Run> {
  const env: NodeJS.ProcessEnv = { ...process.env };
  delete env.NODE_OPTIONS; // nothing of vitest's loaders: the compiled CLI runs on plain node
  delete env.MIGRATE_QUIET; // global setup sets it; these runs log each step they take
  Object.assign(env, { DATABASE_URL: scratchUrl }, opts.env);
  return new Promise((resolve, reject) => {
    const child = spawn(process.execPath, args, {
      cwd: opts.cwd ?? os.tmpdir(),
      env,
      stdio: ["ignore", "pipe", "pipe"],
    });
    let stdout = "";
    let stderr = "";
    child.stdout.on("data", (c: Buffer) => (stdout += c.toString("utf8")));
    child.stderr.on("data", (c: Buffer) => (stderr += c.toString("utf8")));
    child.once("error", reject);
    child.once("close", (code) => resolve({ code, stdout, stderr }));
  });
}

const compiled = (cmd: string, env: Record<string, string> = {}) => node([path.join(OUT, "migrate.js"), cmd], { env });
const viaTsx = (cmd: string) => node(["--import", "tsx", "scripts/migrate.ts", cmd], { cwd: ROOT });

async function query<T>(url: string, sql: string, params: unknown[] = []): Promise<T[]> {
  const c = new pg.Client({ connectionString: url });
  await c.connect();
  try {
    return (await c.query(sql, params)).rows as T[];
  } finally {
    await c.end();
  }
}

const recorded = async (url: string, table: "schema_migrations" | "schema_seeds") =>
  (await query<{ name: string }>(url, `SELECT name FROM ${table} ORDER BY name`)).map((r) => r.name);

/** Umzug's log lines name each step it takes ("migrating", "reverting"); none means nothing ran. */
const steps = (out: string) => [...out.matchAll(/event: '(migrating|reverting)',\s+name: '([^']+)'/g)].map((m) => m[2]);

const ok = (r: Run) => expect(r.code, `exit ${r.code}\n${r.stdout}\n${r.stderr}`).toBe(0);

beforeAll(async () => {
  ok(await node([path.join(ROOT, "scripts", "build-migrate.mjs"), OUT]));
}, 60_000);

afterAll(async () => {
  await query(withDatabase(runUrl, "postgres"), `DROP DATABASE IF EXISTS "${SCRATCH}" WITH (FORCE)`);
  await rm(OUT, { recursive: true, force: true });
});

describe("compiled migration CLI", () => {
  it("builds one self-contained file per migration and seeder, requiring only runtime dependencies", () => {
    const js = (folder: string) =>
      readdirSync(path.join(OUT, folder))
        .filter((f) => f.endsWith(".js"))
        .sort();
    const asJs = (names: string[]) => names.map((n) => n.replace(/\.ts$/, ".js"));
    expect(js("migrations")).toEqual(asJs(sourceNames("migrations")));
    expect(js("seeders")).toEqual(asJs(sourceNames("seeders")));

    const files = [
      "migrate.js",
      ...js("migrations").map((f) => `migrations/${f}`),
      ...js("seeders").map((f) => `seeders/${f}`),
    ];
    const required = new Set<string>();
    for (const f of files) {
      const text = readFileSync(path.join(OUT, f), "utf8");
      for (const m of text.matchAll(/require\("([^"]+)"\)/g)) required.add(m[1]);
    }
    const packageOf = (id: string) =>
      id
        .split("/")
        .slice(0, id.startsWith("@") ? 2 : 1)
        .join("/");
    const outside = [...required].filter((id) => !id.startsWith("node:") && !(packageOf(id) in pkg.dependencies));
    expect(outside).toEqual([]);
    expect(required).toContain("umzug");
  });

  it("seeds a fresh database with plain node, recording the names the tsx path records", async () => {
    ok(await compiled("seed", { MIGRATE_QUIET: "1" }));

    const migrations = await recorded(scratchUrl, "schema_migrations");
    expect(migrations).toEqual(sourceNames("migrations"));
    expect(await recorded(scratchUrl, "schema_seeds")).toEqual(sourceNames("seeders"));
    // This run's own database was migrated through the TypeScript sources (tests/setup/global-setup.ts).
    expect(migrations).toEqual(await recorded(runUrl, "schema_migrations"));
    const [users] = await query<{ n: number }>(scratchUrl, "SELECT count(*)::int AS n FROM users");
    expect(users.n).toBeGreaterThan(0);
  });

  it("runs up and seed again as no-ops", async () => {
    const before = [await recorded(scratchUrl, "schema_migrations"), await recorded(scratchUrl, "schema_seeds")];
    for (const cmd of ["up", "seed"]) {
      const r = await compiled(cmd);
      ok(r);
      expect(steps(r.stdout)).toEqual([]);
    }
    expect([await recorded(scratchUrl, "schema_migrations"), await recorded(scratchUrl, "schema_seeds")]).toEqual(
      before,
    );
  });

  it("hands a database back and forth between the compiled and the tsx path", async () => {
    const last = sourceNames("migrations").at(-1)!;
    const down = await compiled("down");
    ok(down);
    expect(steps(down.stdout)).toEqual([last]);
    expect(await recorded(scratchUrl, "schema_migrations")).not.toContain(last);

    const up = await viaTsx("up");
    ok(up);
    expect(steps(up.stdout)).toEqual([last]);
    expect(await recorded(scratchUrl, "schema_migrations")).toEqual(sourceNames("migrations"));

    const again = await compiled("up");
    ok(again);
    expect(steps(again.stdout)).toEqual([]);
  }, 30_000);

  it("moves a seeder recorded in schema_migrations by the older runner to schema_seeds without seeding twice", async () => {
    const first = sourceNames("seeders")[0];
    await query(scratchUrl, "DELETE FROM schema_seeds WHERE name = $1", [first]);
    await query(scratchUrl, "INSERT INTO schema_migrations (name) VALUES ($1)", [first]);

    const r = await compiled("seed");
    ok(r);
    expect(steps(r.stdout)).toEqual([]);
    expect(await recorded(scratchUrl, "schema_migrations")).toEqual(sourceNames("migrations"));
    expect(await recorded(scratchUrl, "schema_seeds")).toEqual(sourceNames("seeders"));
  });
});
