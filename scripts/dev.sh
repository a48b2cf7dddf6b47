#!/usr/bin/env bash
# npm run dev — like the demo, but Next in development mode with hot reload.
set -euo pipefail
cd "$(dirname "$0")/.."
source scripts/lib.sh
ensure_node_modules
ensure_env
ensure_db
export DATABASE_URL=${DATABASE_URL:-$(bash scripts/db.sh url)}
node --import tsx scripts/migrate.ts seed
start_local_services
trap stop_local_services EXIT
NODE_ENV=development node --import tsx server/index.ts
