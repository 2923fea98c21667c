#!/usr/bin/env bash
# npm start: PostgreSQL, migrations, demo data on an empty database, local service fakes, and the
# API + built front end at http://127.0.0.1:3000. Ctrl-C stops everything this script started.
set -euo pipefail
ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/../.." && pwd)"
cd "$ROOT"
bash backend/scripts/system-deps.sh postgresql
source backend/scripts/local-stack.sh
bash backend/scripts/build.sh
bring_up production
node backend/dist/main.js &
PIDS+=($!)
echo "amberline: http://127.0.0.1:$PORT (API docs at /api/docs; Ctrl-C stops)"
wait "${PIDS[-1]}"
