#!/usr/bin/env bash
# `npm start`: set everything up on a fresh machine and run Shoalshift with demo data.
# Ctrl-C stops what this script started (server, e-mail fake, and the database if it was not
# already running).
set -euo pipefail
source "$(dirname "${BASH_SOURCE[0]}")/lib.sh"
cd "$ROOT"
mkdir -p .data

PORT="${PORT:-8080}"
DB_PORT="${SHOALSHIFT_DB_PORT:-54329}"
SMTP_PORT="${SMTP_PORT:-2525}"
MAIL_HTTP_PORT="${MAIL_FAKE_HTTP_PORT:-2526}"
started_db=0
pids=()

cleanup() {
  # Ctrl-C reaches this script twice (from the terminal, and again forwarded by npm): ignore
  # the second so it cannot cut the cleanup short and leave the database running.
  trap '' INT TERM
  trap - EXIT
  say "stopping…"
  for p in "${pids[@]:-}"; do [ -n "$p" ] && kill -TERM "$p" 2>/dev/null || true; done
  for p in "${pids[@]:-}"; do [ -n "$p" ] && wait "$p" 2>/dev/null || true; done
  if [ "$started_db" = 1 ]; then scripts/db.sh stop pg; fi
  say "stopped."
}
trap cleanup INT TERM EXIT

t0=$(date +%s)
ensure_node_modules

if ! node -e "require('net').connect($DB_PORT,'127.0.0.1').on('connect',()=>process.exit(0)).on('error',()=>process.exit(1))" 2>/dev/null; then
  started_db=1
fi
db_line="$(scripts/db.sh start pg "$DB_PORT" | tail -n 1)"
export "${db_line?}"   # DATABASE_URL=...

export NODE_ENV=development
export PORT APP_URL="http://127.0.0.1:$PORT"
export SESSION_SECRET="$(session_secret)"
export SMTP_HOST=127.0.0.1 SMTP_PORT MAIL_FAKE_HTTP_PORT="$MAIL_HTTP_PORT"
export MAIL_FAKE_URL="http://127.0.0.1:$MAIL_HTTP_PORT"
# The outbox page (captured e-mails, reset links among them) is for this local run only.
export DEV_OUTBOX=on
export STATIC_DIR="$ROOT/dist"

say "database migrations…"
"${TSX[@]}" server/migrate.ts
"${TSX[@]}" server/seed.ts > .data/seed-output.txt
ensure_web_export

"${TSX[@]}" server/mail/fake-smtp.ts > .data/mail-fake.log 2>&1 &
pids+=($!)
"${TSX[@]}" server/index.ts &
pids+=($!)
wait_http "$APP_URL/api/health" 60 || { say "the server did not come up"; exit 1; }

cat <<MSG

  Shoalshift is running at  $APP_URL   (ready in $(( $(date +%s) - t0 )) s)

  Demo sign-ins:
$(grep "^  " .data/seed-output.txt)

  Captured e-mails (local fake, nothing leaves this machine): $APP_URL/dev/outbox
  Press Ctrl-C to stop.

MSG
wait -n "${pids[@]}"
