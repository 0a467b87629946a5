/** @type {import('next').NextConfig} */
const nextConfig = {
  // A separate output folder lets a dev server and a production build coexist.
  distDir: process.env.NEXT_DIST_DIR || ".next",
  poweredByHeader: false,
  serverExternalPackages: [
    "mysql2",
    "bullmq",
    "ioredis",
    "bcryptjs",
    "handlebars",
    "pino",
    "prom-client",
  ],
  // Types are checked once, over the whole project (tests, scripts, worker
  // included), by `npm test` / `npm run typecheck` — not again by every build.
  // The build's own tsconfig keeps Next's edits out of tsconfig.json.
  typescript: { tsconfigPath: "tsconfig.build.json", ignoreBuildErrors: true },
  // Pages and API answers get their security headers from proxy.ts; build assets skip the proxy.
  async headers() {
    return [
      {
        source: "/_next/static/:path*",
        headers: [{ key: "X-Content-Type-Options", value: "nosniff" }],
      },
    ];
  },
};

export default nextConfig;
