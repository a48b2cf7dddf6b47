#!/usr/bin/env bash
# npm run demo — install, start PostgreSQL and the mail catcher, migrate, seed
# the demo, build and serve Getterline at http://localhost:3000.
set -euo pipefail
cd "$(dirname "$0")/.."
source scripts/lib.sh
ensure_node_modules
ensure_env
ensure_db
export DATABASE_URL=${DATABASE_URL:-$(bash scripts/db.sh url)}
export NODE_ENV=production
node --import tsx scripts/migrate.ts seed
if [ ! -f .next/BUILD_ID ] || [ ! -f dist/server.js ] || [ -n "$(find app components lib models server proxy.ts next.config.mjs -newer .next/BUILD_ID -print -quit 2>/dev/null)" ]; then
  npm run build
fi
start_local_services
trap stop_local_services EXIT
echo
echo "  Getterline:  http://localhost:${PORT:-3000}   (demo accounts and password in README.md)"
echo "  Local inbox: http://127.0.0.1:1080   Photos are kept by the local S3 stand-in under .data/s3"
echo
DEMO_LIVE=1 node --enable-source-maps dist/server.js
