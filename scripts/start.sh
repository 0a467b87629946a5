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
  local deadline=$((SECONDS + 15))
  for pid in "${pids[@]}"; do
    while kill -0 "$pid" 2>/dev/null && ((SECONDS < deadline)); do sleep 0.2; done
  done
  log "app stopped (services still running; stop them with: bash scripts/services.sh stop)"
}
trap stop_all INT TERM EXIT

# Each child runs in its own process group (setsid) and reports its own pid
# (setsid may fork), so stopping a group takes the child's children too.
spawn() {
  local pidfile
  pidfile="$(mktemp)"
  setsid bash -c 'echo $$ >"$0"; exec "$@"' "$pidfile" "$@" &
  wait_for 10 "$1" test -s "$pidfile" || die "could not start $*"
  pids+=("$(cat "$pidfile")")
  rm -f "$pidfile"
}
spawn node_modules/.bin/next start -H 127.0.0.1 -p "$PORT"
if [[ -f worker/index.ts ]]; then spawn "${TSX[@]}" worker/index.ts; fi
wait_for 60 app http_ok "http://127.0.0.1:$PORT/sign-in" || die "the app did not answer on port $PORT"
log "ready in $((SECONDS - started)) s → $AUTH_URL   (mail inbox: http://localhost:$MAIL_WEB_PORT; Ctrl-C to stop)"
# Run until one of them exits (or Ctrl-C); the EXIT trap stops the other.
while true; do
  for pid in "${pids[@]}"; do kill -0 "$pid" 2>/dev/null || { warn "process $pid exited"; exit 1; }; done
  sleep 1
done
