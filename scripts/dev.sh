#!/usr/bin/env bash
# npm run dev: API server on PORT and Vite with hot reload on 5173, proxying /api to it.
set -euo pipefail
. "$(dirname "$0")/lib.sh"
cd "$TAULINE_ROOT"
load_env
bash scripts/pg.sh start
node --import tsx scripts/migrate.ts
[ "${SEED_DEMO:-true}" = "true" ] && node --import tsx scripts/seed-demo.ts
node --import tsx --watch server/index.ts &
api=$!
trap 'kill $api 2>/dev/null' EXIT
npx vite --host 127.0.0.1
