// Bundles the web process's preview thread (lib/runs/preview-thread.ts + the
// engine) into <dist>/preview-thread.mjs, after `next build`: the production
// server has no TypeScript loader, and worker threads need a file on disk.
// Usage: node scripts/build-preview-thread.mjs [dist dir, default $NEXT_DIST_DIR or .next]
import { build } from "esbuild";
import { join } from "node:path";

const dist = process.argv[2] || process.env.NEXT_DIST_DIR || ".next";
const outfile = join(dist, "preview-thread.mjs");
await build({
  entryPoints: ["lib/runs/preview-thread.ts"],
  outfile,
  bundle: true,
  platform: "node",
  format: "esm",
  target: "node20",
  tsconfig: "tsconfig.json",
  logLevel: "warning",
  // Some bundled CommonJS packages call require(); give the ES module one.
  banner: {
    js: "import { createRequire as __kwCreateRequire } from 'node:module'; const require = __kwCreateRequire(import.meta.url);",
  },
});
console.log(`preview thread bundled into ${outfile}`);
