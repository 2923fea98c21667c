# Shared by start.sh and dev.sh (sourced): the dev PostgreSQL, a persistent JWT secret, the local fakes, the
# migrations and the demo data, and a cleanup that stops everything started here (PIDS) on exit or Ctrl-C.
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

# bring_up <node-env>: database up, secret, fakes, migrations, demo data on an empty database
bring_up() {
  export DATABASE_URL="$(bash backend/scripts/pg.sh start)"
  mkdir -p .data
  [ -s .data/jwt-secret ] || node -e 'process.stdout.write(require("crypto").randomBytes(32).toString("hex"))' > .data/jwt-secret
  export JWT_SECRET="${JWT_SECRET:-$(cat .data/jwt-secret)}"
  # the payment processor's stand-in gets this machine's own key and webhook secret: the server refuses, in
  # production, the local values written in the repository
  [ -s .data/stripe-key ] || node -e 'process.stdout.write("sk_test_" + require("crypto").randomBytes(16).toString("hex"))' > .data/stripe-key
  [ -s .data/stripe-webhook-secret ] || node -e 'process.stdout.write("whsec_" + require("crypto").randomBytes(24).toString("hex"))' > .data/stripe-webhook-secret
  export STRIPE_SECRET_KEY="${STRIPE_SECRET_KEY:-$(cat .data/stripe-key)}" STRIPE_WEBHOOK_SECRET="${STRIPE_WEBHOOK_SECRET:-$(cat .data/stripe-webhook-secret)}"
  export PORT="${PORT:-3000}" HOST=127.0.0.1 NODE_ENV="$1"
  source backend/scripts/fakes.sh
  start_fakes
  node backend/dist/database/migrate.js
  node backend/dist/demo/load-demo.js
}
