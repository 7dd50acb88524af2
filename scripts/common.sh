#!/usr/bin/env bash
# Shared by start.sh and test.sh: install npm packages from the lock file when needed.
ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
export NEXT_TELEMETRY_DISABLED=1

ensure_node_modules() {
  local stamp="$ROOT/node_modules/.package-lock.json"
  if [ ! -f "$stamp" ] || [ "$ROOT/package-lock.json" -nt "$stamp" ]; then
    echo "[setup] npm ci" >&2
    (cd "$ROOT" && npm ci --no-audit --no-fund --loglevel=error)
  fi
}

ensure_secret() {
  mkdir -p "$ROOT/.data"
  local f="$ROOT/.data/nextauth-secret"
  [ -s "$f" ] || node -e 'process.stdout.write(require("crypto").randomBytes(32).toString("base64url"))' >"$f"
  export NEXTAUTH_SECRET="${NEXTAUTH_SECRET:-$(cat "$f")}"
}

build_app() {
  echo "[setup] next build" >&2
  (cd "$ROOT" && node scripts/build-worker.mjs && node_modules/.bin/next build >"$ROOT/.data/next-build.log" 2>&1) || {
    tail -40 "$ROOT/.data/next-build.log" >&2
    echo "[setup] next build failed; full log in .data/next-build.log" >&2
    return 1
  }
}

# Starts the local fake SMTP server in the background: start_mail_fake PORT CAPTURE_FILE (sets MAIL_PID)
start_mail_fake() {
  local port=$1 file=$2
  mkdir -p "$(dirname "$file")"
  (cd "$ROOT" && node_modules/.bin/tsx scripts/mail-fake.ts "$port" "$file" >"$ROOT/.data/mail-fake-$port.log" 2>&1) &
  MAIL_PID=$!
  for _ in $(seq 1 100); do
    (exec 3<>"/dev/tcp/127.0.0.1/$port") 2>/dev/null && { echo "[mail] fake SMTP on 127.0.0.1:$port" >&2; return 0; }
    sleep 0.1
  done
  echo "[mail] fake SMTP did not start; see .data/mail-fake-$port.log" >&2
  return 1
}

stop_mail_fake() {
  [ -n "${MAIL_PID:-}" ] && pkill -P "$MAIL_PID" 2>/dev/null; [ -n "${MAIL_PID:-}" ] && kill "$MAIL_PID" 2>/dev/null; true
}
