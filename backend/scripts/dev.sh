#!/usr/bin/env bash
# npm run dev: PostgreSQL, the API (rebuilt by `tsc --watch`, restarted by `node --watch`) and the Vite dev
# server with its /api proxy at http://127.0.0.1:5173. Ctrl-C stops everything.
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
}
trap cleanup EXIT INT TERM
SKIP_FRONTEND_BUILD=1 bash backend/scripts/build.sh
export DATABASE_URL="$(bash backend/scripts/pg.sh start)"
mkdir -p .data
[ -s .data/jwt-secret ] || node -e 'process.stdout.write(require("crypto").randomBytes(32).toString("hex"))' > .data/jwt-secret
export JWT_SECRET="$(cat .data/jwt-secret)" PORT=3000 HOST=127.0.0.1 NODE_ENV=development
source backend/scripts/fakes.sh
start_fakes
node backend/dist/database/migrate.js
node backend/dist/demo/load-demo.js
npx tsc -p common/tsconfig.build.json --watch --preserveWatchOutput >/dev/null & PIDS+=($!)
npx tsc -p backend/tsconfig.build.json --watch --preserveWatchOutput & PIDS+=($!)
node --watch backend/dist/main.js & PIDS+=($!)
npm run dev -w frontend & PIDS+=($!)
wait
