#!/usr/bin/env bash
# npm start: install if needed, PostgreSQL on loopback, migrate, seed the demo, local mail catcher, build, serve
# the web app and one background worker (scripts/worker.ts, bundled by scripts/bundle.mjs; more workers:
# `npm run worker` elsewhere).
set -euo pipefail
cd "$(dirname "${BASH_SOURCE[0]}")/.."
export NEXT_TELEMETRY_DISABLED=1
t0=$(date +%s)

[ -d node_modules/next ] || npm install --no-audit --no-fund

if [ ! -f .env ]; then
  secret="$(node -e 'console.log(require("crypto").randomBytes(32).toString("base64url"))')"
  sed "s|^NEXTAUTH_SECRET=.*|NEXTAUTH_SECRET=${secret}|" .env.example > .env
  echo "[start] wrote .env with a generated NEXTAUTH_SECRET"
fi
set -a; . ./.env; set +a
export PG_PORT="${PG_PORT:-54329}"

bash scripts/db.sh start
npx tsx scripts/migrate.ts
npx tsx scripts/seed.ts

pids=()
# Each child runs in its own process group (setsid) so that stopping it stops what it spawned too.
cleanup() { for p in "${pids[@]}"; do kill -TERM -- "-$p" 2>/dev/null || kill "$p" 2>/dev/null || true; done; }
trap cleanup EXIT INT TERM

if [ -f scripts/mail-catcher.ts ]; then
  setsid node node_modules/tsx/dist/cli.mjs scripts/mail-catcher.ts &
  pids+=($!)
fi

echo "[start] building (next build, and the worker's bundle)…"
npx next build
npm run -s build:worker
t1=$(date +%s)
echo "[start] ready in $((t1 - t0)) s"
echo "[start] LoopLedger is at http://127.0.0.1:${PORT:-3000}  (stop with Ctrl-C; 'npm run db:stop' stops PostgreSQL)"
setsid node --enable-source-maps .worker/worker.cjs &
pids+=($!)
setsid node node_modules/next/dist/bin/next start -H 127.0.0.1 -p "${PORT:-3000}" &
pids+=($!)
wait "${pids[-1]}"
