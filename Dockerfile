# syntax=docker/dockerfile:1
# Rackside's container image: the build stage has every npm package (vite, esbuild); the
# runtime stage has the production dependencies only, the built client (dist/), the bundled
# server (dist-server/) and the migrations (drizzle/), and runs as the unprivileged `node` user.
# Used by compose.yaml; README "Hosting Rackside" says how. Needs the same settings as any
# production install (server/env.ts): DATABASE_URL, SESSION_SECRET, PUBLIC_URL and SMTP_URL.

# package.json engines: node >= 20.19. The official Node image, Debian 12 based.
ARG NODE_IMAGE=node:22-bookworm-slim

FROM ${NODE_IMAGE} AS build
WORKDIR /app
COPY package.json package-lock.json .npmrc ./
RUN npm ci --no-audit --no-fund
COPY . .
RUN npm run build

FROM ${NODE_IMAGE} AS runtime
ENV NODE_ENV=production \
    HOST=0.0.0.0 \
    PORT=3000 \
    STORAGE_DIR=/data/storage
WORKDIR /app
COPY package.json package-lock.json .npmrc ./
RUN npm ci --omit=dev --no-audit --no-fund && npm cache clean --force
COPY --from=build /app/dist ./dist
COPY --from=build /app/dist-server ./dist-server
COPY drizzle ./drizzle
# Photos live here: mount a volume (shared by every replica) on /data/storage.
RUN mkdir -p /data/storage && chown node:node /data/storage
USER node
EXPOSE 3000
# /api/health answers 200 with the database up, 503 without it (server/features/health).
HEALTHCHECK --interval=30s --timeout=5s --start-period=30s --retries=3 \
  CMD ["node", "-e", "fetch('http://127.0.0.1:' + (process.env.PORT || 3000) + '/api/health').then((r) => process.exit(r.ok ? 0 : 1), () => process.exit(1))"]
# The same flags as `npm start` (scripts/lib/server-flags.mjs). Migrations run once per deploy,
# before the replicas start: `node dist-server/cli.mjs migrate` (compose.yaml's `migrate`).
CMD ["node", "--enable-source-maps", "--max-old-space-size=160", "dist-server/index.mjs"]
