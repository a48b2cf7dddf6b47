#!/usr/bin/env bash
# Private PostgreSQL cluster for Getterline: data under .data/pg (git-ignored),
# loopback only, non-default port, run as the unprivileged "postgres" OS user.
# Usage: scripts/db.sh start|stop|status|url
# With DATABASE_URL already set (your own server) it does nothing.
set -euo pipefail
cd "$(dirname "$0")/.."
ROOT=$(pwd)
PORT=${PGPORT_LOCAL:-54329}
DATA="$ROOT/.data/pg"
LOG="$ROOT/.data/pg.log"
cmd=${1:-start}

if [ -n "${DATABASE_URL:-}" ] && [ "${GETTERLINE_OWN_DB:-0}" != "1" ]; then
  echo "db: DATABASE_URL is set; using that server and leaving the private cluster alone."
  exit 0
fi

find_pgbin() { ls -d /usr/lib/postgresql/*/bin 2>/dev/null | sort -V | tail -1; }
PGBIN=$(find_pgbin || true)
if [ -z "$PGBIN" ] || [ ! -x "$PGBIN/initdb" ]; then
  if [ "$cmd" != "start" ]; then echo "db: PostgreSQL is not installed"; exit 0; fi
  echo "db: installing PostgreSQL from Debian's packages…"
  if [ "$(id -u)" -ne 0 ]; then echo "db: need root (or sudo) to apt-get install postgresql, or set DATABASE_URL" >&2; exit 1; fi
  export DEBIAN_FRONTEND=noninteractive
  apt-get update -qq
  apt-get install -y -qq postgresql >/dev/null
  # Debian's package may create and start a default cluster; we do not use it.
  PGBIN=$(find_pgbin)
fi

# PostgreSQL refuses to run as root: run it as an unprivileged user.
RUNAS=()
if [ "$(id -u)" -eq 0 ]; then
  id postgres >/dev/null 2>&1 || useradd --system --home-dir /nonexistent --shell /usr/sbin/nologin postgres
  RUNAS=(runuser -u postgres --)
fi

as_pg() { "${RUNAS[@]}" "$@"; }

case "$cmd" in
  start)
    mkdir -p "$DATA"
    [ "$(id -u)" -eq 0 ] && chown postgres: "$ROOT/.data" "$DATA"
    chmod 700 "$DATA"
    if [ ! -s "$DATA/PG_VERSION" ]; then
      as_pg "$PGBIN/initdb" -D "$DATA" -U app --auth=trust -E UTF8 --locale=C.UTF-8 >/dev/null
    fi
    touch "$LOG"; [ "$(id -u)" -eq 0 ] && chown postgres: "$LOG"
    if as_pg "$PGBIN/pg_ctl" -D "$DATA" status >/dev/null 2>&1; then
      echo "db: already running on 127.0.0.1:$PORT"
    else
      # A crash can leave postmaster.pid behind; pg_ctl status said no server
      # runs, so a pid file whose process is gone (or is not postgres) is stale.
      if [ -f "$DATA/postmaster.pid" ]; then
        pid=$(head -1 "$DATA/postmaster.pid")
        if ! ps -p "$pid" -o comm= 2>/dev/null | grep -q postgres; then
          echo "db: removing stale postmaster.pid (pid $pid)"
          rm -f "$DATA/postmaster.pid"
        fi
      fi
      EXTRA=${PG_EXTRA_OPTS:-}
      as_pg "$PGBIN/pg_ctl" -D "$DATA" -l "$LOG" -w -t 60 start \
        -o "-p $PORT -c listen_addresses=127.0.0.1 -c unix_socket_directories= -c max_connections=200 $EXTRA" >/dev/null
      echo "db: started on 127.0.0.1:$PORT"
    fi
    ;;
  stop)
    if [ -s "$DATA/PG_VERSION" ] && as_pg "$PGBIN/pg_ctl" -D "$DATA" status >/dev/null 2>&1; then
      as_pg "$PGBIN/pg_ctl" -D "$DATA" -w -m fast stop >/dev/null
      echo "db: stopped"
    else
      echo "db: not running"
    fi
    ;;
  status)
    as_pg "$PGBIN/pg_ctl" -D "$DATA" status ;;
  url)
    echo "postgres://app@127.0.0.1:$PORT/getterline" ;;
  *) echo "usage: $0 start|stop|status|url" >&2; exit 2 ;;
esac
