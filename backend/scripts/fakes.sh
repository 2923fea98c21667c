# Local stand-ins for outside services, started on loopback by start.sh and test.sh.
# Sourced: defines start_fakes, which appends the PIDs it starts to PIDS and exports their addresses.
start_fakes() {
  start_stripe_fake
  start_mail_catcher
}

# The SMTP catcher with a web inbox (maildev 2.2.1) on loopback: SMTP 1025 and inbox http://127.0.0.1:1080 for
# npm start; 1125 / 1180 under npm test, for the browser-test server (the backend tests catch mail in-process).
start_mail_catcher() {
  local web dir bin
  if [ "${NODE_ENV:-}" = test ]; then
    export SMTP_PORT="${SMTP_PORT:-1125}"; web="${MAILDEV_WEB_PORT:-1180}"
    export APP_URL="${APP_URL:-http://127.0.0.1:${E2E_PORT:-3100}}"
    # test processes leave the outbox to the test that owns it; the browser-test server (started by the
    # browser tests' global setup, which passes this on as MAIL_SEND_INTERVAL_MS) sends every second
    export E2E_MAIL_SEND_INTERVAL_MS="${E2E_MAIL_SEND_INTERVAL_MS:-1000}"
    dir="$(mktemp -d /tmp/amberline-maildev-test.XXXXXX)"
  else
    export SMTP_PORT="${SMTP_PORT:-1025}"; web="${MAILDEV_WEB_PORT:-1080}"
    export APP_URL="${APP_URL:-http://127.0.0.1:${PORT:-3000}}"
    dir=".data/maildev"; mkdir -p "$dir"
  fi
  export SMTP_HOST=127.0.0.1 MAILDEV_WEB_PORT="$web"
  if (exec 3<>"/dev/tcp/127.0.0.1/$SMTP_PORT") 2>/dev/null; then
    echo "mail: something already listens on 127.0.0.1:$SMTP_PORT; using it" >&2
    return 0
  fi
  bin=backend/node_modules/.bin/maildev
  [ -e "$bin" ] || bin=node_modules/.bin/maildev
  mkdir -p .data
  node "$bin" --smtp "$SMTP_PORT" --web "$web" --ip 127.0.0.1 --web-ip 127.0.0.1 --mail-directory "$dir" --silent >> .data/maildev.log 2>&1 &
  PIDS+=($!)
  local i
  for i in $(seq 1 100); do
    (exec 3<>"/dev/tcp/127.0.0.1/$SMTP_PORT") 2>/dev/null && (exec 3<>"/dev/tcp/127.0.0.1/$web") 2>/dev/null && {
      [ "${NODE_ENV:-}" = test ] || echo "mail: inbox at http://127.0.0.1:$web (SMTP 127.0.0.1:$SMTP_PORT)"
      return 0
    }
    sleep 0.1
  done
  echo "maildev did not start on 127.0.0.1:$SMTP_PORT / $web (see .data/maildev.log)" >&2
}

# The payment processor's stand-in (backend/scripts/stripe-fake.js): 12111 for npm start, 12112 under npm test.
# It posts signed events to the running server's webhook route (the browser-test server on E2E_PORT under test).
start_stripe_fake() {
  local app_port
  if [ "${NODE_ENV:-}" = test ]; then
    export STRIPE_API_PORT="${STRIPE_API_PORT:-12112}"; app_port="${E2E_PORT:-3100}"
  else
    export STRIPE_API_PORT="${STRIPE_API_PORT:-12111}"; app_port="${PORT:-3000}"
  fi
  export STRIPE_API_HOST=127.0.0.1 STRIPE_API_PROTOCOL=http
  export STRIPE_SECRET_KEY="${STRIPE_SECRET_KEY:-sk_test_amberline_local}"
  export STRIPE_WEBHOOK_SECRET="${STRIPE_WEBHOOK_SECRET:-whsec_amberline_local}"
  export STRIPE_WEBHOOK_URL="${STRIPE_WEBHOOK_URL:-http://127.0.0.1:$app_port/api/payments/webhook}"
  mkdir -p .data
  node backend/scripts/stripe-fake.js >> .data/stripe-fake.log 2>&1 &
  PIDS+=($!)
  local i
  for i in $(seq 1 50); do
    (exec 3<>"/dev/tcp/127.0.0.1/$STRIPE_API_PORT") 2>/dev/null && return 0
    sleep 0.1
  done
  echo "stripe fake did not start on 127.0.0.1:$STRIPE_API_PORT (see .data/stripe-fake.log)" >&2
}
