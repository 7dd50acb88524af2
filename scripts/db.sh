#!/usr/bin/env bash
# Own MariaDB instance on loopback: install if missing, init, start, stop. Idempotent.
# Usage: scripts/db.sh up|down|status INSTANCE PORT   (env: DB_NAME DB_USER DB_PASSWORD)
set -euo pipefail
ACTION=${1:?up|down|status}; INSTANCE=${2:?instance name}; PORT=${3:?port}
ROOT="$(cd "$(dirname "$0")/.." && pwd)"
DATA="$ROOT/.data/mariadb-$INSTANCE"
SOCK="/tmp/sixfold-$PORT.sock"   # short on purpose: a socket path over 107 characters aborts mariadbd
PID="$DATA/mariadbd.pid"
LOG="$ROOT/.data/mariadb-$INSTANCE.log"
DB_NAME=${DB_NAME:-sixfold}; DB_USER=${DB_USER:-sixfold}; DB_PASSWORD=${DB_PASSWORD:-sixfold-local}
admin() { mariadb-admin --no-defaults --socket="$SOCK" -uroot "$@"; }

ensure_installed() {
  if [ ! -x /usr/sbin/mariadbd ] && ! command -v mariadbd >/dev/null 2>&1; then
    echo "[db] installing Debian mariadb-server" >&2
    apt-get update -qq
    DEBIAN_FRONTEND=noninteractive apt-get install -y -qq mariadb-server >/dev/null
  fi
}

running() { [ -f "$PID" ] && kill -0 "$(cat "$PID")" 2>/dev/null && admin ping >/dev/null 2>&1; }

up() {
  ensure_installed
  PATH="/usr/sbin:$PATH"
  mkdir -p "$ROOT/.data"
  if running; then echo "[db] $INSTANCE already up on 127.0.0.1:$PORT" >&2; else
    # stale pid file or socket from a killed server
    if [ -f "$PID" ] && ! kill -0 "$(cat "$PID")" 2>/dev/null; then rm -f "$PID"; fi
    if [ ! -f "$PID" ]; then rm -f "$SOCK" "$SOCK.lock"; fi
    if [ ! -d "$DATA/mysql" ]; then
      echo "[db] initialising $DATA" >&2
      mkdir -p "$DATA"
      mariadb-install-db --no-defaults --datadir="$DATA" --user=root \
        --auth-root-authentication-method=socket --skip-test-db --skip-name-resolve >"$LOG" 2>&1
    fi
    mariadbd --no-defaults --datadir="$DATA" --user=root --bind-address=127.0.0.1 \
      --port="$PORT" --socket="$SOCK" --pid-file="$PID" --log-error="$LOG" \
      --skip-name-resolve --character-set-server=utf8mb4 --collation-server=utf8mb4_unicode_ci \
      --innodb-buffer-pool-size=64M --max-connections=300 \
      --max-allowed-packet=256M >/dev/null 2>&1 &  # a whole instrument's report runs to tens of MB
    for _ in $(seq 1 150); do admin ping >/dev/null 2>&1 && break; sleep 0.2; done
    admin ping >/dev/null 2>&1 || { echo "[db] server did not start; see $LOG" >&2; tail -20 "$LOG" >&2; exit 1; }
    echo "[db] $INSTANCE up on 127.0.0.1:$PORT" >&2
  fi
  mariadb --no-defaults --socket="$SOCK" -uroot <<SQL
CREATE DATABASE IF NOT EXISTS \`$DB_NAME\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;
CREATE USER IF NOT EXISTS '$DB_USER'@'127.0.0.1' IDENTIFIED BY '$DB_PASSWORD';
CREATE USER IF NOT EXISTS '$DB_USER'@'localhost' IDENTIFIED BY '$DB_PASSWORD';
ALTER USER '$DB_USER'@'127.0.0.1' IDENTIFIED BY '$DB_PASSWORD';
ALTER USER '$DB_USER'@'localhost' IDENTIFIED BY '$DB_PASSWORD';
GRANT ALL PRIVILEGES ON \`$DB_NAME\`.* TO '$DB_USER'@'127.0.0.1';
GRANT ALL PRIVILEGES ON \`$DB_NAME\`.* TO '$DB_USER'@'localhost';
FLUSH PRIVILEGES;
SQL
}

down() {
  PATH="/usr/sbin:$PATH"
  if [ -f "$PID" ] && kill -0 "$(cat "$PID")" 2>/dev/null; then
    local p; p=$(cat "$PID")
    admin shutdown >/dev/null 2>&1 || kill "$p" 2>/dev/null || true
    for _ in $(seq 1 100); do kill -0 "$p" 2>/dev/null || break; sleep 0.1; done
    echo "[db] $INSTANCE stopped" >&2
  else
    echo "[db] $INSTANCE was not running" >&2
  fi
  rm -f "$PID" "$SOCK" "$SOCK.lock"
}

case "$ACTION" in
  up) up ;;
  down) down ;;
  status) if running; then echo up; else echo down; exit 3; fi ;;
  *) echo "usage: $0 up|down|status INSTANCE PORT" >&2; exit 2 ;;
esac
