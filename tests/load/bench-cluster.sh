#!/usr/bin/env bash
# npm run bench:cluster [-- --short] — Ketwise on several network-namespace hosts
# under faults (tests/load/cluster/bench-cluster.ts). Needs root. Builds the app
# into $KETWISE_CLUSTER_DIST (default .next) when stale; npm test passes the
# e2e build it already has. Do not run it beside another build or benchmark.
set -euo pipefail
ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/../.." && pwd)"
source "$ROOT/scripts/lib/common.sh"
source "$ROOT/scripts/lib/build.sh"
cd "$ROOT"
[[ $(id -u) == 0 ]] || die "bench:cluster needs root (it creates network namespaces)"
command -v ip >/dev/null || die "the ip command (iproute2) is missing"
bash scripts/services.sh install
load_env
export KETWISE_CLUSTER_DIST="${KETWISE_CLUSTER_DIST:-.next}"
while pgrep -f "next build" >/dev/null; do log "waiting for another next build to finish"; sleep 5; done
build_if_stale "$KETWISE_CLUSTER_DIST"
exec node --conditions=react-server --import tsx tests/load/cluster/bench-cluster.ts "$@"
