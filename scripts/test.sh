#!/usr/bin/env bash
# npm test — every test: unit and integration (vitest, real PostgreSQL) and
# end-to-end (Playwright in Debian's Chromium against a production build).
# Installs what it needs first, so it can be the first command on a fresh clone.
set -uo pipefail
cd "$(dirname "$0")/.."
source scripts/lib.sh
set -e
ensure_node_modules
ensure_chromium
ensure_env
ensure_db
set +e
set -a; source .env.local; set +a
BASE_URL=${DATABASE_URL:-$(bash scripts/db.sh url)}
unset DATABASE_URL
E2E_DATABASE_URL=$(node -e 'const u=new URL(process.argv[1]);u.pathname="/getterline_e2e";console.log(u.toString())' "$BASE_URL")
export E2E_DATABASE_URL

mkdir -p reports
rm -f reports/vitest.json reports/playwright.json reports/lint.json

echo "== lint and format (ESLint, Prettier)"
if npm run --silent lint; then echo '{"ok":true}' >reports/lint.json; else echo '{"ok":false}' >reports/lint.json; fi

echo "== unit and integration tests (vitest)"
DATABASE_URL=$BASE_URL npx vitest run --reporter=default --reporter=json --outputFile.json=reports/vitest.json
VITEST=$?

echo "== browser tests (Playwright, Debian's Chromium)"
PW=1
if DATABASE_URL=$E2E_DATABASE_URL MIGRATE_QUIET=1 node --import tsx scripts/migrate.ts fresh >/dev/null \
   && NODE_ENV=production npm run build >reports/next-build.log 2>&1; then
  rm -rf .data/mail-test .data/s3-e2e .data/stripe-e2e
  MAIL_CATCHER_SMTP_PORT=2525 MAIL_CATCHER_HTTP_PORT=2580 MAIL_CATCHER_DIR=.data/mail-test S3_FAKE_PORT=4589 S3_FAKE_DIR=.data/s3-e2e STRIPE_FAKE_PORT=12121 STRIPE_FAKE_DIR=.data/stripe-e2e STRIPE_WEBHOOK_URL=http://127.0.0.1:3100/api/webhooks/stripe STRIPE_FAKE_RETRY_BASE_MS=200 \
    start_local_services
  npx playwright test
  PW=$?
  stop_local_services
else
  echo "e2e: preparing the database or building failed; see reports/next-build.log" >&2
  tail -30 reports/next-build.log >&2
fi

echo "== summary"
node scripts/test-summary.mjs
SUMMARY=$?
[ $VITEST -eq 0 ] && [ $PW -eq 0 ] && [ $SUMMARY -eq 0 ]
