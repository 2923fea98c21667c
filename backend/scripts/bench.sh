#!/usr/bin/env bash
# npm run bench: the product on its own PostgreSQL with the large dataset, then API latency under load
# (autocannon), SQL queries per request, front-end weight and first render, and the engine's plan check.
# Prints PASS/FAIL per budget and writes backend/scripts/bench/results.md.
set -euo pipefail
ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/../.." && pwd)"
cd "$ROOT"
export PGPORT="${BENCH_PGPORT:-54331}" PGDB=amberline_bench PGDATA_DIR="$ROOT/.data/pg-bench"
export PG_EXTRA_OPTS="-c shared_preload_libraries=pg_stat_statements -c max_connections=200"
PIDS=()
cleanup() {
  for p in "${PIDS[@]}"; do kill "$p" 2>/dev/null || true; done
  bash backend/scripts/pg.sh stop >/dev/null 2>&1 || true
}
trap cleanup EXIT INT TERM
bash backend/scripts/pg.sh stop >/dev/null 2>&1 || true   # restart so the preload option takes effect
bash backend/scripts/system-deps.sh postgresql
bash backend/scripts/pg.sh start >/dev/null
bash backend/scripts/pg.sh recreate
export DATABASE_URL="postgres://postgres@127.0.0.1:$PGPORT/$PGDB"
bash backend/scripts/pg.sh psql -qc "CREATE EXTENSION IF NOT EXISTS pg_stat_statements" >/dev/null
bash backend/scripts/build.sh
# production mode refuses secrets written in the repository: this run makes its own
rand() { node -e "process.stdout.write('$1' + require('crypto').randomBytes(24).toString('hex'))"; }
export JWT_SECRET="$(rand '')" STRIPE_SECRET_KEY="$(rand sk_test_)" STRIPE_WEBHOOK_SECRET="$(rand whsec_)"
export NODE_ENV=production PORT="${BENCH_PORT:-3300}" HOST=127.0.0.1
source backend/scripts/fakes.sh
start_fakes
node backend/dist/database/migrate.js
SEED_START=$(date +%s%N)
node backend/dist/demo/seed-large.js
export SEED_MS=$(( ($(date +%s%N) - SEED_START) / 1000000 ))
node backend/dist/main.js > .data/bench-server.log 2>&1 &
PIDS+=($!)
for _ in $(seq 1 60); do curl -sf "http://127.0.0.1:$PORT/api/health" >/dev/null && break; sleep 0.5; done
node backend/scripts/bench/run-bench.js
