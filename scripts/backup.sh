#!/usr/bin/env bash
# npm run backup [-- FILE]   : dumps the database (default: the demo one) to FILE (default .data/backups/sixfold-<time>.sql.gz)
# npm run restore -- FILE    : restores FILE into the database named by DB_NAME (dropped and created anew)
# Uses mariadb-dump / mariadb through the instance's own socket as the database root (OS root, no password).
set -euo pipefail
cd "$(dirname "$0")/.."
ACTION=${1:?backup|restore}; shift || true
PORT=${DB_PORT:-3407}; NAME=${DB_NAME:-sixfold}; USER_=${DB_USER:-sixfold}
SOCK="/tmp/sixfold-$PORT.sock"
PATH="/usr/sbin:/usr/bin:$PATH"
[ -S "$SOCK" ] || { echo "[backup] no database is running on port $PORT (start it with npm start, or DB_PORT=…)" >&2; exit 2; }

case "$ACTION" in
  backup)
    FILE=${1:-.data/backups/sixfold-$(date -u +%Y%m%dT%H%M%SZ).sql.gz}
    mkdir -p "$(dirname "$FILE")"
    mariadb-dump --no-defaults --socket="$SOCK" -uroot --single-transaction --skip-lock-tables --routines --hex-blob "$NAME" | gzip -c >"$FILE.part"
    mv "$FILE.part" "$FILE"
    echo "[backup] $NAME → $FILE ($(du -h "$FILE" | cut -f1))" >&2
    ;;
  restore)
    FILE=${1:?usage: npm run restore -- FILE}
    [ -f "$FILE" ] || { echo "[backup] no such file: $FILE" >&2; exit 2; }
    gzip -t "$FILE" 2>/dev/null || { echo "[backup] $FILE is not a gzip'd dump" >&2; exit 2; }
    mariadb --no-defaults --socket="$SOCK" -uroot -e "DROP DATABASE IF EXISTS \`$NAME\`; CREATE DATABASE \`$NAME\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci; GRANT ALL PRIVILEGES ON \`$NAME\`.* TO '$USER_'@'127.0.0.1'; GRANT ALL PRIVILEGES ON \`$NAME\`.* TO '$USER_'@'localhost';"
    gunzip -c "$FILE" | mariadb --no-defaults --socket="$SOCK" -uroot "$NAME"
    echo "[backup] $FILE → $NAME restored" >&2
    ;;
  *) echo "usage: backup.sh backup [FILE] | restore FILE" >&2; exit 2 ;;
esac
