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

bash backend/scripts/system-deps.sh postgresql chromium || { echo "0 passed, 1 failed"; exit 1; }
bash backend/scripts/pg.sh start >/dev/null || { echo "0 passed, 1 failed"; exit 1; }
bash backend/scripts/pg.sh recreate || { echo "0 passed, 1 failed"; exit 1; }
export DATABASE_URL="postgres://postgres@127.0.0.1:$PGPORT/$PGDB"
export JWT_SECRET="test-secret-not-for-production" NODE_ENV=test
# the tests stand behind a proxy on loopback: each test gives its own client address in X-Forwarded-For
export TRUST_PROXY="${TRUST_PROXY:-loopback}"
bash backend/scripts/build.sh || { echo "0 passed, 1 failed"; exit 1; }
node backend/dist/database/migrate.js || { echo "0 passed, 1 failed"; exit 1; }
source backend/scripts/fakes.sh
start_fakes

mkdir -p .data
export NODE_OPTIONS="--experimental-vm-modules --disable-warning=ExperimentalWarning"
# unit and integration tests side by side; then the browser tests one file at a time, so the single server under
# test and Chromium are not starved of the machine's two cores
run_jest() { # run_jest <counts-file> <jest args...>
  local out="$1"; shift
  rm -f "$out"
  JEST_COUNTS_FILE="$out" npx jest --testTimeout=30000 --forceExit --reporters=default --reporters="$ROOT/backend/scripts/count-reporter.cjs" "$@"
}
rc=0
# each run's counts files carry its PostgreSQL port, so two runs side by side (other ports) keep their own
COUNTS=".data/counts-$PGPORT"
# lint counts as one test in the closing line
if npm run -s lint; then lint='{"passed":1,"failed":0,"total":1}'; else rc=1; lint='{"passed":0,"failed":1,"total":1}'; fi
echo "$lint" > "$COUNTS-lint.json"
run_jest "$COUNTS-unit.json" --projects common/jest.config.cjs backend/jest.config.cjs frontend/jest.config.cjs --maxWorkers=2 --passWithNoTests "$@" || rc=$?
run_jest "$COUNTS-browser.json" --projects frontend/e2e/jest.config.cjs --runInBand --passWithNoTests "$@" || rc=$?
# the closing line: every test of both runs; a run that wrote no counts (jest itself failed) is one failure
node -e '
  const fs = require("fs");
  let passed = 0, failed = 0, ran = 0;
  for (const f of process.argv.slice(1)) {
    if (!fs.existsSync(f)) { failed += 1; continue; }
    const r = JSON.parse(fs.readFileSync(f, "utf8"));
    passed += r.passed; failed += r.failed; ran += r.total;
  }
  console.log(`${passed} passed, ${failed} failed`);
  if (ran === 0) process.exit(1);
' "$COUNTS-lint.json" "$COUNTS-unit.json" "$COUNTS-browser.json" || rc=1
exit $rc
