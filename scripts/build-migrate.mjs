// Compiles the database CLI for production, so running migrations and seeders needs neither tsx nor any other dev
// tool (building needs esbuild, a dev dependency, as the server's build does):
//   <outdir>/migrate.js        scripts/migrate.ts bundled like the server (packages stay external)
//   <outdir>/migrations/*.js   one self-contained file per migration (our lib code bundled in)
//   <outdir>/seeders/*.js      one self-contained file per seeder (seeders/support and lib bundled in)
// Usage: node scripts/build-migrate.mjs [outdir]   (default dist; npm run build:server runs it)
// The outdir must sit inside the project, so the bundles find node_modules by walking up.
import { readdirSync, rmSync } from "node:fs";
import path from "node:path";
import { fileURLToPath } from "node:url";
import { build } from "esbuild";

const root = fileURLToPath(new URL("..", import.meta.url));
const outdir = path.resolve(root, process.argv[2] ?? "dist");

/** The same options as the server's bundle (package.json build:server). */
const common = {
  absWorkingDir: root,
  bundle: true,
  platform: "node",
  target: "node20",
  format: "cjs",
  packages: "external",
  sourcemap: true,
  logLevel: "warning",
};

const sources = (folder) =>
  readdirSync(path.join(root, folder))
    .filter((f) => f.endsWith(".ts"))
    .map((f) => `${folder}/${f}`);

// Start the compiled folders empty, so a migration renamed or removed in the sources leaves no stale copy behind.
for (const folder of ["migrations", "seeders"]) rmSync(path.join(outdir, folder), { recursive: true, force: true });

await Promise.all([
  build({
    ...common,
    entryPoints: ["scripts/migrate.ts"],
    outfile: path.join(outdir, "migrate.js"),
    // Tells lib/db/migrator.ts to load the compiled files beside this bundle.
    define: { GETTERLINE_COMPILED_MIGRATIONS: "true" },
  }),
  build({ ...common, entryPoints: [...sources("migrations"), ...sources("seeders")], outbase: ".", outdir }),
]);
