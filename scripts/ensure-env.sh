#!/usr/bin/env bash
# Writes .env.local (git-ignored) with secrets generated on first run.
# Existing values are kept, so sessions and signed links survive restarts.
set -euo pipefail
cd "$(dirname "$0")/.."
F=.env.local
touch "$F"; chmod 600 "$F"
gen() { node -e 'process.stdout.write(require("crypto").randomBytes(32).toString("base64url"))'; }
add() { grep -q "^$1=" "$F" || echo "$1=$2" >> "$F"; }
add NEXTAUTH_SECRET "$(gen)"
add STRIPE_WEBHOOK_SECRET "whsec_$(gen)"
add STRIPE_SECRET_KEY "sk_test_local_$(gen)"
