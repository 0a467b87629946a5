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
results="$DATA_DIR/vitest-results.json"
rm -f "$results"
npx vitest run --reporter=default --reporter=json --outputFile.json="$results" "$@" || status=$?
cluster_passed=0 cluster_failed=0
if [[ $# -eq 0 ]]; then
  # The multi-host check (network namespaces, root) on the e2e project's build, short form.
  log "multi-host check: npm run bench:cluster -- --short"
  cluster_log="$DATA_DIR/cluster-check.log"
  if KETWISE_CLUSTER_DIST=.next-e2e bash tests/load/bench-cluster.sh --short 2>&1 | tee "$cluster_log"; then :; else status=1; fi
  read -r cluster_passed cluster_failed < <(sed -nE 's/^([0-9]+) passed, ([0-9]+) failed$/\1 \2/p' "$cluster_log" | tail -n 1) || true
  if [[ -z ${cluster_failed:-} ]]; then cluster_passed=0 cluster_failed=1; status=1; fi
fi
log "npm test finished in $((SECONDS - started)) s (exit $status)"
# One closing line over everything that ran: the Vitest projects and the multi-host check.
node -e '
  const fs = require("node:fs");
  const [file, cp, cf, status] = process.argv.slice(1);
  let passed = Number(cp), failed = Number(cf);
  if (fs.existsSync(file)) {
    const r = JSON.parse(fs.readFileSync(file, "utf8"));
    passed += r.numPassedTests; failed += r.numFailedTests;
  } else if (status !== "0") failed += 1;
  console.log(`Tests: ${passed} passed, ${failed} failed`);
' "$results" "$cluster_passed" "$cluster_failed" "$status"
exit "$status"
