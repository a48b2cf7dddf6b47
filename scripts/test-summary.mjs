// Sums vitest's and Playwright's JSON reports into the one plain line CI reads:
//   "N passed, N failed, N skipped"
import { existsSync, readFileSync } from "node:fs";

let passed = 0,
  failed = 0,
  skipped = 0;
const problems = [];

if (existsSync("reports/vitest.json")) {
  const v = JSON.parse(readFileSync("reports/vitest.json", "utf8"));
  passed += v.numPassedTests ?? 0;
  failed += v.numFailedTests ?? 0;
  skipped += (v.numPendingTests ?? 0) + (v.numTodoTests ?? 0);
  if ((v.numFailedTestSuites ?? 0) > 0 && (v.numFailedTests ?? 0) === 0) {
    failed += v.numFailedTestSuites;
    problems.push("vitest: a test file failed to load");
  }
} else problems.push("no vitest report");

if (existsSync("reports/playwright.json")) {
  const p = JSON.parse(readFileSync("reports/playwright.json", "utf8"));
  passed += (p.stats?.expected ?? 0) + (p.stats?.flaky ?? 0);
  failed += p.stats?.unexpected ?? 0;
  skipped += p.stats?.skipped ?? 0;
  if ((p.errors ?? []).length) {
    failed += p.errors.length;
    problems.push("playwright: errors outside tests");
  }
} else problems.push("no playwright report");

// Lint and format count as one check: a tree that fails them does not pass.
if (existsSync("reports/lint.json")) {
  const l = JSON.parse(readFileSync("reports/lint.json", "utf8"));
  if (l.ok) passed += 1;
  else {
    failed += 1;
    problems.push("lint: ESLint or Prettier reported problems (npm run lint)");
  }
} else problems.push("no lint report");

for (const m of problems) console.log(`summary: ${m}`);
console.log(`${passed} passed, ${failed} failed, ${skipped} skipped`);
process.exit(failed > 0 || problems.length > 0 || passed === 0 ? 1 : 0);
