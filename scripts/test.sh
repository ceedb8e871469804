#!/usr/bin/env bash
# npm test: typecheck, lint, unit + integration tests against a throwaway PostgreSQL cluster and
# the local fakes, then end-to-end tests in Chromium against a production build. Ends with one
# line "N passed, N failed" over every test it ran; exits non-zero on any failure.
set -uo pipefail
. "$(dirname "$0")/lib/common.sh"

RUN_ID="$$"
DATA="$ROOT/.data"
TMP="$DATA/test-$RUN_ID"
PG_PORT="${DARNWELL_TEST_PG_PORT:-54339}"
SMTP_PORT="${DARNWELL_TEST_SMTP_PORT:-2526}"
MAIL_HTTP_PORT="${DARNWELL_TEST_MAIL_HTTP_PORT:-2581}"
APP_PORT="${DARNWELL_TEST_APP_PORT:-3100}"
S3_PORT="${DARNWELL_TEST_S3_PORT:-4569}"
DIST="${DARNWELL_TEST_DIST:-.next-test}"
mkdir -p "$TMP"

PIDS=()
cleanup() {
  trap - EXIT INT TERM
  [ -n "${WATCHDOG_PID:-}" ] && kill "$WATCHDOG_PID" 2>/dev/null || true
  for pid in "${PIDS[@]}"; do kill -TERM -- "-$pid" 2>/dev/null || kill -TERM "$pid" 2>/dev/null || true; done
  stop_descendants
  wait 2>/dev/null || true
  pg_down "$TMP/pg"
  rm -rf "$TMP"
}
trap cleanup EXIT
trap 'exit 130' INT TERM
# npm passes INT/TERM on to this script (package.json runs it with exec); if npm itself dies, stop too.
watch_parent

FAILED_STEPS=()
step_fail() { FAILED_STEPS+=("$1"); printf '\033[1;31m[darnwell] %s failed\033[0m\n' "$1"; }

ensure_node_modules
[ -x /usr/bin/chromium ] || apt_install chromium
command -v pdftoppm >/dev/null || apt_install poppler-utils

# --- services --------------------------------------------------------------------------
for p in "$PG_PORT:PostgreSQL" "$SMTP_PORT:mail" "$MAIL_HTTP_PORT:mail API" "$APP_PORT:the app" "$S3_PORT:object storage"; do ensure_port_free "${p%%:*}" "${p#*:}"; done
pg_up "$TMP/pg" "$PG_PORT"
pg_create_db "$PG_PORT" darnwell_test
setsid node --import tsx scripts/fakes/mail.ts --smtp-port "$SMTP_PORT" --http-port "$MAIL_HTTP_PORT" \
  --store "$TMP/mail.jsonl" >"$TMP/mail.log" 2>&1 &
PIDS+=($!)
wait_http "http://127.0.0.1:$MAIL_HTTP_PORT/health" 30 || die "the local mail service did not start"

setsid node --import tsx scripts/fakes/storage.ts --port "$S3_PORT" --dir "$TMP/s3" >"$TMP/storage.log" 2>&1 &
PIDS+=($!)
wait_http "http://127.0.0.1:$S3_PORT/" 30 || die "the local object storage did not start"
# slot: the local payments fake is started here
PAY_PORT="${DARNWELL_TEST_PAY_PORT:-12112}"
ensure_port_free "$PAY_PORT" "the local payments service"
export STRIPE_SECRET_KEY="sk_test_run_$(node -e 'console.log(require("crypto").randomBytes(16).toString("hex"))')"
export STRIPE_WEBHOOK_SECRET="whsec_run_$(node -e 'console.log(require("crypto").randomBytes(16).toString("hex"))')"
export STRIPE_API_URL="http://127.0.0.1:$PAY_PORT"
setsid node --import tsx scripts/fakes/payments.ts --port "$PAY_PORT" --webhook-url "http://127.0.0.1:$APP_PORT/api/payments/webhook" \
  --store "$TMP/payments.json" >"$TMP/payments.log" 2>&1 &
PIDS+=($!)
wait_http "$STRIPE_API_URL/health" 30 || die "the local payments service did not start"

export S3_ENDPOINT="http://127.0.0.1:$S3_PORT"
export DATABASE_URL="postgres://darnwell@127.0.0.1:$PG_PORT/darnwell_test"
export SMTP_URL="smtp://127.0.0.1:$SMTP_PORT"
export LOCAL_MAIL_API="http://127.0.0.1:$MAIL_HTTP_PORT"
export BETTER_AUTH_SECRET="test-secret-$(node -e 'console.log(require("crypto").randomBytes(24).toString("hex"))')"
export BETTER_AUTH_URL="http://127.0.0.1:$APP_PORT"
export DARNWELL_DEMO=1
export NEXT_TELEMETRY_DISABLED=1

say "applying migrations and the demo scenario"
npx tsx scripts/db-migrate.ts || die "migrations failed"
npx tsx db/seed.ts || die "seeding failed"

# --- static checks -----------------------------------------------------------------------
say "typecheck"
run_step npx tsc --noEmit || step_fail typecheck
say "lint"
run_step npx eslint --max-warnings 0 . || step_fail lint

# --- unit + integration ------------------------------------------------------------------
say "unit and integration tests"
run_step env OUTBOX_WORKER=off AUTH_SIGNIN_LIMIT=5 npx vitest run --reporter=default --reporter=json --outputFile.json="$TMP/vitest.json" \
  || step_fail "unit/integration tests"

# --- end-to-end --------------------------------------------------------------------------
say "end-to-end tests (production build, Chromium)"
E2E_JSON="$TMP/e2e.json"
if build_app "$DIST" 2>&1; then
  NEXT_DIST_DIR="$DIST" NODE_ENV=production AUTH_SIGNIN_LIMIT=500 \
    setsid npx next start -H 127.0.0.1 -p "$APP_PORT" >"$TMP/app.log" 2>&1 &
  PIDS+=($!)
  if wait_http "http://127.0.0.1:$APP_PORT/api/health" 90; then
    run_step env E2E_BASE_URL="$BETTER_AUTH_URL" E2E_DIST_DIR="$DIST" npx vitest run --config vitest.e2e.config.mts --reporter=default \
      --reporter=json --outputFile.json="$E2E_JSON" || step_fail "end-to-end tests"
  else
    tail -n 30 "$TMP/app.log"; step_fail "app start"
  fi
else
  step_fail build
fi

# --- summary -----------------------------------------------------------------------------
read -r PASSED FAILED < <(node -e '
  const fs = require("fs"); let p = 0, f = 0;
  for (const file of process.argv.slice(1)) {
    if (!fs.existsSync(file)) continue;
    const r = JSON.parse(fs.readFileSync(file, "utf8"));
    p += r.numPassedTests; f += r.numFailedTests;
  }
  console.log(p, f);' "$TMP/vitest.json" "$E2E_JSON")
if [ "${#FAILED_STEPS[@]}" -gt 0 ]; then
  say "failed steps: ${FAILED_STEPS[*]}"
  [ "$FAILED" = "0" ] && FAILED="${#FAILED_STEPS[@]}"
fi
echo "$PASSED passed, $FAILED failed"
[ "${#FAILED_STEPS[@]}" -eq 0 ] && [ "$FAILED" = "0" ] && [ "$PASSED" -gt 0 ]
