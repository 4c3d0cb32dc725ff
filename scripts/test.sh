#!/usr/bin/env bash
# npm test: type check, build the client, then every vitest project (unit, client, API on a
# throwaway PostgreSQL, browser end-to-end in Debian's Chromium). Ends with "N passed, N failed".
set -euo pipefail
. "$(dirname "$0")/lib.sh"
cd "$TAULINE_ROOT"

ensure_pg_installed
ensure_chromium_installed
[ -d node_modules ] || { log "installing dependencies (npm ci)"; npm ci; }

eval "$(bash scripts/pg-temp.sh start)"
trap 'bash scripts/pg-temp.sh stop "$TAULINE_TEST_PG_DIR"' EXIT

log "type checking"
npm run --silent typecheck
log "linting"
npx eslint .
log "building the client"
npx vite build --logLevel warn

status=0
npx vitest run --reporter=default --reporter=json --outputFile=.vitest-result.json "$@" || status=$?
node -e '
  const fs = require("fs")
  if (!fs.existsSync(".vitest-result.json")) { console.log("vitest: 0 passed, 1 failed"); process.exit(0) }
  const r = JSON.parse(fs.readFileSync(".vitest-result.json", "utf8"))
  console.log(`vitest: ${r.numPassedTests} passed, ${r.numFailedTests} failed`)
'
exit $status
