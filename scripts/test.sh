#!/usr/bin/env bash
# npm test: services (+ Chromium, npm packages) → lint and format check → fresh test database →
# migrations → type check → every Vitest project.
# Extra arguments go to vitest, e.g. `npm test -- --project unit`.
set -euo pipefail
source "$(dirname "${BASH_SOURCE[0]}")/lib/common.sh"
cd "$ROOT"
started=$SECONDS

bash scripts/services.sh start --browser   # also installs npm packages when missing
log "linting (eslint, no warnings allowed) and checking the format (prettier)"
npm run --silent lint || die "lint errors (above) — fix them before the tests run"
npm run --silent format:check || die "unformatted files (above) — run \`npm run format\`"
load_env
[[ -x /usr/bin/chromium ]] || die "Chromium is missing at /usr/bin/chromium (apt-get install chromium)"
bash scripts/services.sh reset-db "${DB_NAME}_test"
export DATABASE_URL="${DATABASE_URL%/*}/${DB_NAME}_test"
export REDIS_URL="redis://127.0.0.1:$REDIS_PORT/1"
redis-cli -p "$REDIS_PORT" -n 1 flushdb >/dev/null
node --conditions=react-server --import tsx scripts/migrate.ts

export NEXT_TELEMETRY_DISABLED=1
log "type-checking the whole project (tsc --noEmit)"
npx tsc --noEmit -p tsconfig.json || die "type errors (above) — fix them before the tests run"
status=0
npx vitest run "$@" || status=$?
log "npm test finished in $((SECONDS - started)) s (exit $status)"
exit "$status"
