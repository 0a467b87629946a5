# syntax=docker/dockerfile:1
# Ketwise web app + worker image (the same image runs `next start`, the
# worker, the migrations and the mail sink; see compose.yaml).
# Build context: the repository root.
#   docker build -f docker/Dockerfile.app -t ketwise-app .
# The worker and scripts run TypeScript through tsx, so node_modules keeps
# its dev dependencies.

FROM node:20.20-bookworm-slim AS deps
WORKDIR /app
COPY package.json package-lock.json ./
RUN npm ci --no-audit --no-fund

FROM deps AS build
ENV NEXT_TELEMETRY_DISABLED=1
COPY . .
RUN npx next build

FROM node:20.20-bookworm-slim AS runtime
WORKDIR /app
ENV NODE_ENV=production \
    NEXT_TELEMETRY_DISABLED=1 \
    PORT=3000
COPY --from=build --chown=node:node /app /app
USER node
EXPOSE 3000
HEALTHCHECK --interval=10s --timeout=3s --start-period=20s --retries=5 \
  CMD node -e "fetch('http://127.0.0.1:3000/sign-in').then(r=>process.exit(r.ok?0:1),()=>process.exit(1))"
CMD ["npx", "next", "start", "-H", "0.0.0.0", "-p", "3000"]
