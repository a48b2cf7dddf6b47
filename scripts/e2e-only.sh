#!/usr/bin/env bash
# Developer shortcut: run some browser tests against the current build on a fresh e2e database.
#   bash scripts/e2e-only.sh tests/e2e/consignment.spec.ts
set -uo pipefail
cd "$(dirname "$0")/.."
source scripts/lib.sh
set -a; source .env.local; set +a
BASE_URL=${DATABASE_URL:-$(bash scripts/db.sh url)}
unset DATABASE_URL
export E2E_DATABASE_URL=$(node -e 'const u=new URL(process.argv[1]);u.pathname="/getterline_e2e";console.log(u.toString())' "$BASE_URL")
DATABASE_URL=$E2E_DATABASE_URL MIGRATE_QUIET=1 node --import tsx scripts/migrate.ts fresh >/dev/null
# The server Playwright starts is the compiled one: rebuild it from the current source (under a second).
npm run --silent build:server
MAIL_CATCHER_SMTP_PORT=2525 MAIL_CATCHER_HTTP_PORT=2580 MAIL_CATCHER_DIR=.data/mail-test S3_FAKE_PORT=4589 S3_FAKE_DIR=.data/s3-e2e STRIPE_FAKE_PORT=12121 STRIPE_FAKE_DIR=.data/stripe-e2e STRIPE_WEBHOOK_URL=http://127.0.0.1:3100/api/webhooks/stripe STRIPE_FAKE_RETRY_BASE_MS=200 start_local_services
npx playwright test "$@"
rc=$?
stop_local_services
exit $rc
