#!/usr/bin/env bash
# npm start: services → migrations → demo seed → build → app (+ worker) in the foreground.
# Ctrl-C stops the app and the worker; the services keep running (scripts/services.sh stop).
set -euo pipefail
source "$(dirname "${BASH_SOURCE[0]}")/lib/common.sh"
source "$ROOT/scripts/lib/build.sh"
cd "$ROOT"
started=$SECONDS

bash scripts/services.sh start
load_env
TSX=(node --conditions=react-server --import tsx)
"${TSX[@]}" scripts/migrate.ts
if [[ $DEMO_SEED == on || $DEMO_SEED == true || $DEMO_SEED == 1 ]]; then "${TSX[@]}" scripts/seed.ts; fi
build_if_stale .next

export NODE_ENV=production NEXT_TELEMETRY_DISABLED=1
pids=()
stop_all() {
  trap - INT TERM EXIT
  for pid in "${pids[@]}"; do kill -- "-$pid" 2>/dev/null || kill "$pid" 2>/dev/null || true; done
  wait 2>/dev/null || true
  log "app stopped (services still running; stop them with: bash scripts/services.sh stop)"
}
trap stop_all INT TERM EXIT

setsid npx next start -H 127.0.0.1 -p "$PORT" &
pids+=($!)
if [[ -f worker/index.ts ]]; then
  setsid "${TSX[@]}" worker/index.ts &
  pids+=($!)
fi
wait_for 60 app http_ok "http://127.0.0.1:$PORT/sign-in" || die "the app did not answer on port $PORT"
log "ready in $((SECONDS - started)) s → $AUTH_URL   (mail inbox: http://localhost:$MAIL_WEB_PORT; Ctrl-C to stop)"
wait -n "${pids[@]}"
