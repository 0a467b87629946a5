#!/usr/bin/env bash
# build_if_stale DIST_DIR — runs `next build` into DIST_DIR unless its BUILD_ID is
# newer than every source file the build reads, then bundles the web process's
# preview thread into DIST_DIR/preview-thread.mjs. Source after common.sh.
build_if_stale() {
  local dist="$1" stamp="$ROOT/$1/BUILD_ID"
  if [[ -f $stamp && -z ${FORCE_BUILD:-} ]]; then
    local newer
    newer="$(cd "$ROOT" && find app components lib db public worker next.config.mjs postcss.config.mjs \
      tsconfig.json tsconfig.build.json package-lock.json -newer "$stamp" -type f -print -quit 2>/dev/null || true)"
    if [[ -z $newer && -f $ROOT/$dist/preview-thread.mjs ]]; then log "build in $dist is up to date"; return 0; fi
  fi
  log "building the app (next build → $dist)"
  local started=$SECONDS
  (cd "$ROOT" && NODE_ENV=production NEXT_DIST_DIR="$dist" NEXT_TELEMETRY_DISABLED=1 npx next build) || die "next build failed"
  (cd "$ROOT" && node scripts/build-preview-thread.mjs "$dist") || die "bundling the preview thread failed"
  log "built in $((SECONDS - started)) s"
}
