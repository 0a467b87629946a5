#!/usr/bin/env bash
# npm run bench:api — the runs pipeline under load, on the production build:
# services → fresh <name>_bench database → migrations → `next build` if stale →
# tests/load/bench-api.ts (starts `next start` and the worker processes itself).
# Do not run it beside `npm test` or another build: it measures a 2-core machine.
set -euo pipefail
ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/../.." && pwd)"
source "$ROOT/scripts/lib/common.sh"
source "$ROOT/scripts/lib/build.sh"
cd "$ROOT"

bash scripts/services.sh start
load_env
while pgrep -f "next build" >/dev/null; do log "waiting for another next build to finish"; sleep 5; done
build_if_stale .next

BENCH_DB="${DB_NAME}_bench"
bash scripts/services.sh reset-db "$BENCH_DB"
export DATABASE_URL="${DATABASE_URL%/*}/$BENCH_DB"
export NODE_ENV=production NEXT_TELEMETRY_DISABLED=1
node --conditions=react-server --import tsx scripts/migrate.ts
exec node --conditions=react-server --import tsx tests/load/bench-api.ts "$@"
