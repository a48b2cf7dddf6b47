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
