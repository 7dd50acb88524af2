#!/usr/bin/env bash
# npm run stop: stops a demo or test database left running by an interrupted command.
set -uo pipefail
cd "$(dirname "$0")/.."
bash scripts/db.sh down demo "${DB_PORT:-3407}"
bash scripts/db.sh down test 3408
