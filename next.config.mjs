/** @type {import('next').NextConfig} */
const nextConfig = {
  // A separate output folder lets a dev server and a production build coexist.
  distDir: process.env.NEXT_DIST_DIR || ".next",
  poweredByHeader: false,
  serverExternalPackages: ["mysql2", "bullmq", "ioredis", "bcryptjs"],
  // The build type-checks what it ships (app, components, lib, db); tests,
  // scripts, the worker and docker/ are checked by `npm run typecheck`.
  typescript: { tsconfigPath: "tsconfig.build.json" },
};

export default nextConfig;
