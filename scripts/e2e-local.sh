#!/usr/bin/env bash
# Developer helper: run end-to-end tests against the PostgreSQL cluster, mail service and storage
# of a running `npm start`, with a database, build folder and port of their own, so several
# people can run them side by side.   bash scripts/e2e-local.sh NAME PORT [test files…]
set -uo pipefail
. "$(dirname "$0")/lib/common.sh"
NAME="${1:?name}"; PORT="${2:?port}"; shift 2
PG_PORT="${DARNWELL_PG_PORT:-54329}"
DB="darnwell_e2e_${NAME//[^a-z0-9_]/_}"
for p in "$PG_PORT" 2525 2580 4568; do
  (exec 3<>"/dev/tcp/127.0.0.1/$p") 2>/dev/null || die "nothing listens on 127.0.0.1:$p: start \`npm start\` first"
done
ensure_port_free "$PORT" "this run's app"
set -a; . "$ROOT/.data/secrets.env"; set +a
export DATABASE_URL="postgres://darnwell@127.0.0.1:$PG_PORT/$DB" SMTP_URL=smtp://127.0.0.1:2525 \
  LOCAL_MAIL_API=http://127.0.0.1:2580 S3_ENDPOINT=http://127.0.0.1:4568 BETTER_AUTH_URL="http://127.0.0.1:$PORT" \
  DARNWELL_DEMO=1 NEXT_TELEMETRY_DISABLED=1
psql -h 127.0.0.1 -p "$PG_PORT" -U darnwell -d postgres -qc "drop database if exists \"$DB\" with (force)" >/dev/null
pg_create_db "$PG_PORT" "$DB"
npx tsx scripts/db-migrate.ts && npx tsx db/seed.ts || die "migrate/seed failed"
# next build adds its folder to tsconfig.json; keep the committed file as it is.
cp tsconfig.json "$ROOT/.data/tsconfig.$NAME.json"
build_app ".next-$NAME"; rc=$?
cp "$ROOT/.data/tsconfig.$NAME.json" tsconfig.json
[ $rc -eq 0 ] || exit 1
# Optional: a payments fake of this run's own (E2E_PAYMENTS_PORT=12150), delivering to this app.
if [ -n "${E2E_PAYMENTS_PORT:-}" ]; then
  ensure_port_free "$E2E_PAYMENTS_PORT" "this run's payments fake"
  export STRIPE_SECRET_KEY="sk_test_e2e_$(node -e 'console.log(require("crypto").randomBytes(16).toString("hex"))')"
  export STRIPE_WEBHOOK_SECRET="whsec_e2e_$(node -e 'console.log(require("crypto").randomBytes(16).toString("hex"))')"
  export STRIPE_API_URL="http://127.0.0.1:$E2E_PAYMENTS_PORT"
  setsid node --import tsx scripts/fakes/payments.ts --port "$E2E_PAYMENTS_PORT" --webhook-url "$BETTER_AUTH_URL/api/payments/webhook" >"$ROOT/.data/payments-$NAME.log" 2>&1 &
  PAYFAKE=$!
  wait_http "$STRIPE_API_URL/health" 30 || die "the payments fake did not start"
fi
NEXT_DIST_DIR=".next-$NAME" NODE_ENV=production AUTH_SIGNIN_LIMIT=500 setsid npx next start -H 127.0.0.1 -p "$PORT" >"$ROOT/.data/app-$NAME.log" 2>&1 &
APP=$!
trap 'kill -TERM -- -$APP 2>/dev/null; [ -n "${PAYFAKE:-}" ] && kill -TERM -- -$PAYFAKE 2>/dev/null' EXIT
wait_http "http://127.0.0.1:$PORT/api/health" 90 || { tail -n 30 "$ROOT/.data/app-$NAME.log"; die "app did not start"; }
E2E_BASE_URL="http://127.0.0.1:$PORT" E2E_DIST_DIR=".next-$NAME" npx vitest run --config vitest.e2e.config.mts "$@"
