#!/usr/bin/env bash
# npm start: PostgreSQL, migrations, demo data on an empty database, local service fakes, and the
# API + built front end at http://127.0.0.1:3000. Ctrl-C stops everything this script started.
set -euo pipefail
ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/../.." && pwd)"
cd "$ROOT"
export PGPORT="${PGPORT:-54329}" PGDB="${PGDB:-amberline}"
PIDS=()
cleanup() {
  trap - EXIT INT TERM
  for p in "${PIDS[@]}"; do kill "$p" 2>/dev/null || true; done
  wait 2>/dev/null || true
  bash backend/scripts/pg.sh stop || true
  echo "amberline: stopped"
}
trap cleanup EXIT INT TERM

bash backend/scripts/build.sh
export DATABASE_URL="$(bash backend/scripts/pg.sh start)"
mkdir -p .data
[ -s .data/jwt-secret ] || node -e 'process.stdout.write(require("crypto").randomBytes(32).toString("hex"))' > .data/jwt-secret
export JWT_SECRET="${JWT_SECRET:-$(cat .data/jwt-secret)}"
export PORT="${PORT:-3000}" HOST=127.0.0.1 NODE_ENV=production
source backend/scripts/fakes.sh
start_fakes

node backend/dist/database/migrate.js
node backend/dist/demo/load-demo.js
node backend/dist/main.js &
PIDS+=($!)
echo "amberline: http://127.0.0.1:$PORT (API docs at /api/docs; Ctrl-C stops)"
wait "${PIDS[-1]}"
