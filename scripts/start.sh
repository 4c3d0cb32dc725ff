#!/usr/bin/env bash
# npm start: database up, schema migrated, demo data seeded, client built, app served.
set -euo pipefail
. "$(dirname "$0")/lib.sh"
cd "$TAULINE_ROOT"
load_env
bash scripts/pg.sh start
log "migrating the database"
node --import tsx scripts/migrate.ts
[ "${SEED_DEMO:-true}" = "true" ] && node --import tsx scripts/seed-demo.ts
log "building the client"
npx vite build --logLevel warn
node --import tsx scripts/print-demo.ts
exec node --import tsx server/index.ts
