/** @type {import('next').NextConfig} */
const nextConfig = {
  // A separate output folder lets a dev server and a production build coexist.
  distDir: process.env.NEXT_DIST_DIR || ".next",
  poweredByHeader: false,
  serverExternalPackages: ["mysql2", "bullmq", "ioredis", "bcryptjs"],
};

export default nextConfig;
