#!/usr/bin/env bash
# npm test: unit, integration (own MariaDB on :3408) and browser tests (Debian chromium). Installs what it needs.
set -euo pipefail
source "$(dirname "$0")/common.sh"
cd "$ROOT"
export DB_PORT=3408 DB_USER=sixfold DB_PASSWORD=sixfold-test
mkdir -p .data/results

ensure_node_modules
status=0
echo "== lint (eslint with the import boundaries, prettier)" >&2
if ! node_modules/.bin/eslint . || ! node_modules/.bin/prettier --check --log-level warn "**/*.{ts,tsx,mjs,mts,css}"; then
  echo "[test] lint failed: fix the reports above (npm run lint; npm run format)" >&2
  status=1
fi
missing=""
[ -x /usr/bin/chromium ] || missing="$missing chromium"
command -v curl >/dev/null 2>&1 || missing="$missing curl"
if [ -n "$missing" ]; then
  echo "[test] installing Debian packages:$missing" >&2
  apt-get update -qq && DEBIAN_FRONTEND=noninteractive apt-get install -y -qq $missing >/dev/null
fi
DB_NAME=sixfold_it bash scripts/db.sh up test "$DB_PORT"
DB_NAME=sixfold_e2e bash scripts/db.sh up test "$DB_PORT"
export SMTP_PORT=2526 MAIL_CAPTURE_FILE="$ROOT/.data/mail/test-captured.jsonl"
rm -f "$MAIL_CAPTURE_FILE"
start_mail_fake "$SMTP_PORT" "$MAIL_CAPTURE_FILE"
trap 'stop_mail_fake; bash scripts/db.sh down test "$DB_PORT" || true' EXIT
node scripts/build-worker.mjs

echo "== unit and integration tests (vitest)" >&2
DB_NAME=sixfold_it SIXFOLD_MAIL_TIMER=off node_modules/.bin/vitest run --reporter=default --reporter=json \
  --outputFile.json=.data/results/vitest.json || status=1

echo "== browser tests (playwright, Debian chromium)" >&2
export NEXTAUTH_SECRET=test-secret-not-for-production
build_app
DB_NAME=sixfold_e2e PLAYWRIGHT_JSON_OUTPUT_NAME=.data/results/playwright.json \
  node_modules/.bin/playwright test --reporter=list,json || status=1

node scripts/test-summary.mjs .data/results/vitest.json .data/results/playwright.json || status=1
exit $status
