#!/usr/bin/env bash
# npm start: set everything up on this machine and serve Darnwell at http://127.0.0.1:3000.
# Uses real services where their variables are set (DATABASE_URL, SMTP_URL); starts local ones
# for the rest. Ctrl-C stops everything this script started.
set -euo pipefail
. "$(dirname "$0")/lib/common.sh"

DATA="$ROOT/.data"
APP_PORT="${PORT:-3000}"
PG_PORT="${DARNWELL_PG_PORT:-54329}"
SMTP_PORT="${DARNWELL_SMTP_PORT:-2525}"
MAIL_HTTP_PORT="${DARNWELL_MAIL_HTTP_PORT:-2580}"
S3_PORT="${DARNWELL_S3_PORT:-4568}"
mkdir -p "$DATA"

PIDS=()
STARTED_PG=""
cleanup() {
  trap - EXIT INT TERM
  [ -n "${WATCHDOG_PID:-}" ] && kill "$WATCHDOG_PID" 2>/dev/null || true
  say "stopping"
  for pid in "${PIDS[@]}"; do kill -TERM -- "-$pid" 2>/dev/null || kill -TERM "$pid" 2>/dev/null || true; done
  stop_descendants
  wait 2>/dev/null || true
  [ -n "$STARTED_PG" ] && pg_down "$STARTED_PG"
  say "stopped"
}
trap cleanup EXIT
trap 'exit 130' INT TERM
# npm passes INT/TERM on to this script (package.json runs it with exec); if npm itself dies, stop too.
watch_parent

ensure_node_modules

# --- secrets -----------------------------------------------------------------------------
if [ -n "${DATABASE_URL:-}" ]; then
  # A deployment with its own database brings its own secrets.
  [ -n "${BETTER_AUTH_SECRET:-}" ] || die "BETTER_AUTH_SECRET is not set. A deployment that sets DATABASE_URL must also set BETTER_AUTH_SECRET (32+ random characters)."
  export DARNWELL_DEMO=0
else
  [ -n "${BETTER_AUTH_SECRET:-}" ] || ensure_local_secrets "$DATA/secrets.env"
  export DARNWELL_DEMO=1
fi
export BETTER_AUTH_URL="${BETTER_AUTH_URL:-http://127.0.0.1:$APP_PORT}"

# --- PostgreSQL --------------------------------------------------------------------------
if [ -z "${DATABASE_URL:-}" ]; then
  pg_up "$DATA/pg" "$PG_PORT"
  STARTED_PG="$DATA/pg"
  pg_create_db "$PG_PORT" darnwell
  export DATABASE_URL="postgres://darnwell@127.0.0.1:$PG_PORT/darnwell"
  PG_WHERE="local cluster in .data/pg, 127.0.0.1:$PG_PORT (database darnwell)"
else
  PG_WHERE="DATABASE_URL (your server)"
fi

# --- mail ---------------------------------------------------------------------------------
if [ -z "${SMTP_URL:-}" ]; then
  ensure_port_free "$SMTP_PORT" "the local mail service"; ensure_port_free "$MAIL_HTTP_PORT" "the local mail service"
  setsid node --import tsx scripts/fakes/mail.ts --smtp-port "$SMTP_PORT" --http-port "$MAIL_HTTP_PORT" \
    --store "$DATA/mail/messages.jsonl" >"$DATA/mail.log" 2>&1 &
  PIDS+=($!)
  wait_http "http://127.0.0.1:$MAIL_HTTP_PORT/health" 30 || die "the local mail service did not start (see .data/mail.log)"
  export SMTP_URL="smtp://127.0.0.1:$SMTP_PORT"
  export LOCAL_MAIL_API="http://127.0.0.1:$MAIL_HTTP_PORT"
  MAIL_WHERE="local mail service, SMTP 127.0.0.1:$SMTP_PORT; read it at $BETTER_AUTH_URL/local-inbox"
else
  unset LOCAL_MAIL_API
  MAIL_WHERE="SMTP_URL (your provider)"
fi

# --- object storage ------------------------------------------------------------------------
if [ -z "${S3_ENDPOINT:-}" ]; then
  ensure_port_free "$S3_PORT" "the local object storage"
  setsid node --import tsx scripts/fakes/storage.ts --port "$S3_PORT" --dir "$DATA/s3" >"$DATA/storage.log" 2>&1 &
  PIDS+=($!)
  wait_http "http://127.0.0.1:$S3_PORT/" 30 || die "the local object storage did not start (see .data/storage.log)"
  export S3_ENDPOINT="http://127.0.0.1:$S3_PORT"
  STORAGE_WHERE="local S3 fake at $S3_ENDPOINT (files in .data/s3)"
else
  STORAGE_WHERE="S3_ENDPOINT (your storage)"
fi

# --- payments (slot: the local payments fake is started here) --------------------------------
PAY_PORT="${DARNWELL_PAY_PORT:-12111}"
if [ -z "${STRIPE_SECRET_KEY:-}" ]; then
  ensure_port_free "$PAY_PORT" "the local payments service"
  # Fresh test keys for this run (local only); the fake reads them from the environment.
  export STRIPE_SECRET_KEY="sk_test_local_$(node -e 'console.log(require("crypto").randomBytes(16).toString("hex"))')"
  export STRIPE_WEBHOOK_SECRET="whsec_local_$(node -e 'console.log(require("crypto").randomBytes(16).toString("hex"))')"
  export STRIPE_API_URL="http://127.0.0.1:$PAY_PORT"
  setsid node --import tsx scripts/fakes/payments.ts --port "$PAY_PORT" --webhook-url "$BETTER_AUTH_URL/api/payments/webhook" \
    --store "$DATA/payments.json" >"$DATA/payments.log" 2>&1 &
  PIDS+=($!)
  wait_http "$STRIPE_API_URL/health" 30 || die "the local payments service did not start (see .data/payments.log)"
  PAYMENTS_WHERE="local payments fake at $STRIPE_API_URL (test card 4242 4242 4242 4242 pays, 4000 0000 0000 0002 is declined; state in .data/payments.json)"
else
  [ -n "${STRIPE_WEBHOOK_SECRET:-}" ] || die "STRIPE_WEBHOOK_SECRET is not set. With STRIPE_SECRET_KEY set, also set the webhook signing secret of your endpoint ($BETTER_AUTH_URL/api/payments/webhook)."
  PAYMENTS_WHERE="Stripe with STRIPE_SECRET_KEY${STRIPE_API_URL:+ at $STRIPE_API_URL}"
fi

# --- schema, demo data, build -------------------------------------------------------------
say "applying migrations"
npx tsx scripts/db-migrate.ts
if [ "$DARNWELL_DEMO" = "1" ]; then npx tsx db/seed.ts; fi
build_app .next

ensure_port_free "$APP_PORT" "the app"
# --- serve --------------------------------------------------------------------------------
NODE_ENV=production setsid npx next start -H 127.0.0.1 -p "$APP_PORT" >"$DATA/app.log" 2>&1 &
PIDS+=($!)
wait_http "http://127.0.0.1:$APP_PORT/api/health" 90 || { tail -n 30 "$DATA/app.log"; die "the app did not start (see .data/app.log)"; }

cat <<INFO

  Darnwell is running at  $BETTER_AUTH_URL
  Database                $PG_WHERE
  Mail                    $MAIL_WHERE
  Object storage          $STORAGE_WHERE
  Payments                $PAYMENTS_WHERE
  Logs                    .data/app.log, .data/mail.log, .data/storage.log, .data/payments.log, .data/pg/server.log

INFO
if [ "$DARNWELL_DEMO" = "1" ]; then
  cat <<INFO
  Demo accounts (password: darnwell-demo)
    owner      maren@hollin.test     → /studio
    assistant  tobias@hollin.test    → /studio
    clients    priya@example.test, elias@example.test, saoirse@example.test → /portal
  Public studio page: $BETTER_AUTH_URL/studios/hollin-knitworks

INFO
fi
say "press Ctrl-C to stop"
wait "${PIDS[-1]}"
