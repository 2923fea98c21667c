#!/usr/bin/env bash
# npm run dev: PostgreSQL, the API (rebuilt by `tsc --watch`, restarted by `node --watch`) and the Vite dev
# server with its /api proxy at http://127.0.0.1:5173. Ctrl-C stops everything.
set -euo pipefail
ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/../.." && pwd)"
cd "$ROOT"
bash backend/scripts/system-deps.sh postgresql
source backend/scripts/local-stack.sh
SKIP_FRONTEND_BUILD=1 bash backend/scripts/build.sh
bring_up development
npx tsc -p common/tsconfig.build.json --watch --preserveWatchOutput >/dev/null & PIDS+=($!)
npx tsc -p backend/tsconfig.build.json --watch --preserveWatchOutput & PIDS+=($!)
node --watch backend/dist/main.js & PIDS+=($!)
npm run dev -w frontend & PIDS+=($!)
wait
