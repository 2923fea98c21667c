#!/usr/bin/env bash
# npm test: its own PostgreSQL (own data folder and port, never the demo data), migrations once,
# unit + integration + browser tests, then the closing line `N passed, N failed`.
set -uo pipefail
ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/../.." && pwd)"
cd "$ROOT"
export PGPORT="${TEST_PGPORT:-54330}" PGDB=amberline_test PGDATA_DIR="${TEST_PGDATA_DIR:-$ROOT/.data/pg-test}"
PIDS=()
cleanup() {
  for p in "${PIDS[@]}"; do kill "$p" 2>/dev/null || true; done
  bash backend/scripts/pg.sh stop >/dev/null 2>&1 || true
}
trap cleanup EXIT INT TERM

bash backend/scripts/pg.sh start >/dev/null || { echo "0 passed, 1 failed"; exit 1; }
bash backend/scripts/pg.sh recreate || { echo "0 passed, 1 failed"; exit 1; }
export DATABASE_URL="postgres://postgres@127.0.0.1:$PGPORT/$PGDB"
export JWT_SECRET="test-secret-not-for-production" NODE_ENV=test
bash backend/scripts/build.sh || { echo "0 passed, 1 failed"; exit 1; }
node backend/dist/database/migrate.js || { echo "0 passed, 1 failed"; exit 1; }
source backend/scripts/fakes.sh
start_fakes

mkdir -p .data
RESULTS=.data/jest-results.json
rm -f "$RESULTS"
NODE_OPTIONS="--experimental-vm-modules --disable-warning=ExperimentalWarning" npx jest \
  --projects common/jest.config.cjs backend/jest.config.cjs frontend/e2e/jest.config.cjs \
  --maxWorkers=2 --testTimeout=30000 --forceExit --json --outputFile="$RESULTS" "$@"
rc=$?
if [ -s "$RESULTS" ]; then
  node -e 'const r=require(process.argv[1]);console.log(`${r.numPassedTests} passed, ${r.numFailedTests} failed`)' "$ROOT/$RESULTS"
else
  echo "0 passed, 1 failed"
  [ $rc -eq 0 ] && rc=1
fi
exit $rc
