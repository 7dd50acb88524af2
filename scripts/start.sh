#!/usr/bin/env bash
# npm start: MariaDB (own instance), migrations, demo data, mail fake, production build, server on :3000.
set -euo pipefail
source "$(dirname "$0")/common.sh"
cd "$ROOT"
export DB_PORT=${DB_PORT:-3407} DB_NAME=${DB_NAME:-sixfold} DB_USER=${DB_USER:-sixfold} DB_PASSWORD=${DB_PASSWORD:-sixfold-local}
PORT=${PORT:-3000}
export NEXTAUTH_URL=${NEXTAUTH_URL:-http://localhost:$PORT}

ensure_node_modules
ensure_secret
bash scripts/db.sh up demo "$DB_PORT"
node_modules/.bin/tsx --conditions=react-server scripts/migrate.ts latest
node_modules/.bin/tsx --conditions=react-server scripts/migrate.ts seed
build_app
export SMTP_PORT=${SMTP_PORT:-2525} MAIL_CAPTURE_FILE=${MAIL_CAPTURE_FILE:-$ROOT/.data/mail/captured.jsonl}
start_mail_fake "$SMTP_PORT" "$MAIL_CAPTURE_FILE"

cleanup() {
  [ -n "${APP_PID:-}" ] && kill "$APP_PID" 2>/dev/null || true
  stop_mail_fake
  bash scripts/db.sh down demo "$DB_PORT" || true
}
trap cleanup EXIT INT TERM
echo "[start] Sixfold on http://localhost:$PORT  (Ctrl+C stops the app and its database)" >&2
node_modules/.bin/next start -p "$PORT" -H 127.0.0.1 &
APP_PID=$!
wait "$APP_PID"
