#!/usr/bin/env bash
# Helpers shared by start.sh and test.sh. Sourced, not run.
ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
say() { printf '\033[1m[shoalshift]\033[0m %s\n' "$*" >&2; }
TSX=(node "$ROOT/node_modules/tsx/dist/cli.mjs" --tsconfig "$ROOT/server/tsconfig.json")

# Dependencies from the lockfile, only when missing or older than the lockfile.
ensure_node_modules() {
  if [ ! -f "$ROOT/node_modules/.package-lock.json" ] || [ "$ROOT/package-lock.json" -nt "$ROOT/node_modules/.package-lock.json" ]; then
    say "installing dependencies from package-lock.json (npm ci)…"
    (cd "$ROOT" && npm ci --no-audit --no-fund --loglevel=error)
  fi
}

# The exported web app is rebuilt only when a client-side source changed since the last export.
ensure_web_export() {
  local stamp="$ROOT/dist/index.html"
  if [ -f "$stamp" ] && [ -z "$(cd "$ROOT" && find app components constants hooks lib assets shared simulation app.json index.ts metro.config.js public package-lock.json -newer "$stamp" -type f 2>/dev/null | head -n 1)" ]; then
    return 0
  fi
  say "building the web app (expo export, ~30 s the first time)…"
  (cd "$ROOT" && CI=1 npx expo export --platform web --output-dir dist >"$ROOT/.data/web-export.log" 2>&1) || {
    tail -n 40 "$ROOT/.data/web-export.log" >&2; say "web export failed (log: .data/web-export.log)"; return 1; }
  touch "$stamp"
}

# Debian's Chromium for the browser tests; installed when missing (as root).
ensure_chromium() {
  if [ -x /usr/lib/chromium/chromium ] || [ -x /usr/bin/chromium ]; then return 0; fi
  if [ "$(id -u)" -ne 0 ]; then
    say "Chromium is not installed. Install it once with: sudo apt-get update && sudo apt-get install -y chromium"
    return 3
  fi
  say "installing Chromium from Debian's packages (one time, ~30 s)…"
  DEBIAN_FRONTEND=noninteractive apt-get update -qq >/dev/null
  DEBIAN_FRONTEND=noninteractive apt-get install -y -qq chromium >/dev/null
}

# A random secret kept in .data so sessions survive restarts of the local server.
session_secret() {
  local f="$ROOT/.data/session-secret"
  if [ ! -s "$f" ]; then head -c 48 /dev/urandom | base64 | tr -d '\n' > "$f"; chmod 600 "$f"; fi
  cat "$f"
}

# Waits until an HTTP URL answers (any status), up to $2 seconds.
wait_http() {
  local url="$1" secs="${2:-30}" i
  for ((i = 0; i < secs * 10; i++)); do
    if node -e "fetch(process.argv[1]).then(()=>process.exit(0),()=>process.exit(1))" "$url" 2>/dev/null; then return 0; fi
    sleep 0.1
  done
  return 1
}
