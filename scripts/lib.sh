# Shared set-up steps for scripts/demo.sh, scripts/dev.sh and scripts/test.sh.
# Each step is idempotent, so any script can be the first thing run on a fresh clone.

ensure_node_modules() {
  if [ ! -d node_modules ] || [ package-lock.json -nt node_modules/.package-lock.json ]; then
    echo "setup: installing npm packages (npm ci)…"
    npm ci --no-audit --no-fund --loglevel=error
  fi
}

ensure_chromium() {
  if ! command -v chromium >/dev/null 2>&1; then
    echo "setup: installing Debian's chromium for browser tests…"
    if [ "$(id -u)" -ne 0 ]; then echo "setup: need root to apt-get install chromium" >&2; return 1; fi
    export DEBIAN_FRONTEND=noninteractive
    apt-get update -qq
    apt-get install -y -qq chromium >/dev/null
  fi
}

ensure_env() { bash scripts/ensure-env.sh; }

ensure_db() { bash scripts/db.sh start; }

# Free a TCP port held by an earlier run of ours (never touches other programs' ports blindly: asks first).
port_busy() { (exec 3<>"/dev/tcp/127.0.0.1/$1") 2>/dev/null; }

# Start the local stand-ins for hosted services (mail catcher, S3 fake, Stripe fake) unless
# something already answers on their ports. Their pids go to BACKGROUND_PIDS;
# call stop_local_services on exit.
BACKGROUND_PIDS=""
start_local_services() {
  mkdir -p .data
  local smtp=${MAIL_CATCHER_SMTP_PORT:-1025} inbox=${MAIL_CATCHER_HTTP_PORT:-1080} s3=${S3_FAKE_PORT:-4569} pay=${STRIPE_FAKE_PORT:-12111}
  if port_busy "$inbox"; then
    echo "services: a mail catcher already answers on $inbox"
  else
    MAIL_CATCHER_SMTP_PORT=$smtp MAIL_CATCHER_HTTP_PORT=$inbox \
      node --import tsx server/mail-catcher.ts >> .data/mail-catcher.log 2>&1 &
    BACKGROUND_PIDS="$BACKGROUND_PIDS $!"
  fi
  if port_busy "$s3"; then
    echo "services: an S3 fake already answers on $s3"
  else
    S3_FAKE_PORT=$s3 node --import tsx server/s3-fake.ts >> .data/s3-fake.log 2>&1 &
    BACKGROUND_PIDS="$BACKGROUND_PIDS $!"
  fi
  if port_busy "$pay"; then
    echo "services: a payments fake already answers on $pay"
  else
    STRIPE_FAKE_PORT=$pay STRIPE_WEBHOOK_URL=${STRIPE_WEBHOOK_URL:-http://127.0.0.1:${PORT:-3000}/api/webhooks/stripe} \
      node --import tsx server/stripe-fake/index.ts >> .data/stripe-fake.log 2>&1 &
    BACKGROUND_PIDS="$BACKGROUND_PIDS $!"
  fi
  for _ in $(seq 1 150); do
    port_busy "$inbox" && port_busy "$s3" && port_busy "$pay" && return 0
    sleep 0.1
  done
  echo "services: mail catcher, S3 fake or payments fake did not start (see .data/*.log)" >&2
  return 1
}

stop_local_services() {
  [ -n "$BACKGROUND_PIDS" ] && kill $BACKGROUND_PIDS 2>/dev/null
  return 0
}
