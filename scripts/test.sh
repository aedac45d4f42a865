#!/usr/bin/env bash
# `npm test`: every test, from a fresh clone. Type checks (app, server), unit tests, API tests
# against a real PostgreSQL, browser tests in Debian's Chromium against the exported web app
# served by the real Express server. Ends with one plain "N passed, N failed" line.
set -uo pipefail
source "$(dirname "${BASH_SOURCE[0]}")/lib.sh"
cd "$ROOT"
mkdir -p .data test-results/screenshots

DB_PORT="${SHOALSHIFT_TEST_DB_PORT:-54339}"
E2E_PORT="${E2E_PORT:-3101}"
SMTP_PORT=2535 MAIL_HTTP_PORT=2536
passed=0 failed=0
pids=()
cleanup() {
  for p in "${pids[@]:-}"; do [ -n "$p" ] && kill -TERM "$p" 2>/dev/null || true; done
  for p in "${pids[@]:-}"; do [ -n "$p" ] && wait "$p" 2>/dev/null || true; done
  scripts/db.sh stop pg-test
}
trap cleanup EXIT
step() { # step NAME CMD...: a pass/fail step of its own (type checks)
  local name="$1"; shift
  say "$name…"
  if "$@"; then passed=$((passed + 1)); else failed=$((failed + 1)); say "FAILED: $name"; fi
}

ensure_node_modules || exit 1
ensure_chromium || exit 1

step "type check (app, engine, shared)" npx tsc -p tsconfig.json --noEmit
step "type check (server)" npx tsc -p server/tsconfig.json --noEmit

api_url="$(scripts/db.sh start pg-test "$DB_PORT" shoalshift_api | tail -n 1)"; api_url="${api_url#DATABASE_URL=}"
e2e_url="$(scripts/db.sh start pg-test "$DB_PORT" shoalshift_e2e | tail -n 1)"; e2e_url="${e2e_url#DATABASE_URL=}"
[ -n "$api_url" ] && [ -n "$e2e_url" ] || { echo "0 passed, 1 failed"; exit 1; }

# The browser tests run against a freshly seeded database and the real server.
ensure_web_export || { echo "$passed passed, $((failed + 1)) failed"; exit 1; }
psql "$e2e_url" -qc 'drop schema public cascade; create schema public;' >/dev/null 2>&1
export NODE_ENV=test SESSION_SECRET="$(head -c 48 /dev/urandom | base64 | tr -d '\n')" SMTP_HOST=127.0.0.1
(
  export DATABASE_URL="$e2e_url"
  "${TSX[@]}" server/migrate.ts >/dev/null && "${TSX[@]}" server/seed.ts >/dev/null
) || { say "could not prepare the browser-test database"; echo "$passed passed, $((failed + 1)) failed"; exit 1; }
SMTP_PORT=$SMTP_PORT MAIL_FAKE_HTTP_PORT=$MAIL_HTTP_PORT "${TSX[@]}" server/mail/fake-smtp.ts > .data/test-mail-fake.log 2>&1 &
pids+=($!)
DATABASE_URL="$e2e_url" PORT="$E2E_PORT" APP_URL="http://127.0.0.1:$E2E_PORT" STATIC_DIR="$ROOT/dist" \
  SMTP_PORT=$SMTP_PORT MAIL_FAKE_URL="http://127.0.0.1:$MAIL_HTTP_PORT" \
  "${TSX[@]}" server/index.ts > .data/test-server.log 2>&1 &
pids+=($!)
if ! wait_http "http://127.0.0.1:$E2E_PORT/api/health" 60; then
  say "the test server did not start:"; tail -n 30 .data/test-server.log >&2
  failed=$((failed + 1))
fi

say "vitest (unit, api, browser)…"
DATABASE_URL="$api_url" E2E_BASE_URL="http://127.0.0.1:$E2E_PORT" E2E_MAIL_URL="http://127.0.0.1:$MAIL_HTTP_PORT" \
  npx vitest run --reporter=default --reporter=json --outputFile.json=test-results/vitest.json
counts="$(node -e '
  const r = require("./test-results/vitest.json");
  const failedSuites = (r.testResults || []).filter((f) => f.status === "failed" && (f.assertionResults || []).length === 0).length;
  console.log(r.numPassedTests, r.numFailedTests + failedSuites);
' 2>/dev/null || echo "0 1")"
read -r vp vf <<<"$counts"
passed=$((passed + vp)); failed=$((failed + vf))
echo "$passed passed, $failed failed"
[ "$failed" -eq 0 ]
