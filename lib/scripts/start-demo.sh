#!/usr/bin/env bash
# The README's first command: from a fresh clone to Trammel with demo data on
# http://localhost:3000. Installs what is missing, starts the project's own PostgreSQL on
# loopback, migrates, seeds the invented demo scenario, builds and serves. Ctrl-C stops the app;
# `bash db/pg.sh stop` stops the database.
set -euo pipefail
ROOT=$(cd "$(dirname "$0")/../.." && pwd)
cd "$ROOT"
export TMPDIR=$ROOT/.data/tmp XDG_CONFIG_HOME=$ROOT/.data/xdg XDG_CACHE_HOME=$ROOT/.data/xdg-cache
mkdir -p "$TMPDIR"
PORT=${PORT:-3000}

bash lib/scripts/ensure-deps.sh
# The geometry CLI (`npm run geometry`) runs from a bundle made here, at build time.
npm run -s build:cli
bash db/pg.sh start
export DATABASE_URL=${DATABASE_URL:-$(bash db/pg.sh url)}
# The local S3-compatible store for uploaded originals (s3rver, files in .data/s3); Ctrl-C stops it with the app.
npx tsx lib/storage/dev-s3.ts >.data/s3.log 2>&1 &
export STORAGE_DRIVER=${STORAGE_DRIVER:-s3} S3_ENDPOINT=${S3_ENDPOINT:-http://127.0.0.1:4569}
for _ in $(seq 60); do curl -s -o /dev/null "$S3_ENDPOINT" && break; sleep 0.25; done
# The address printed on reports and in their QR codes (required in production; the seed issues reports).
export PUBLIC_URL=${PUBLIC_URL:-http://localhost:$PORT}
npm run -s db:migrate
npm run -s db:seed
echo "start-demo: building the app…" >&2
npx next build >.data/build.log 2>&1 || { tail -40 .data/build.log; exit 1; }
export NEXTAUTH_URL=${NEXTAUTH_URL:-http://localhost:$PORT}
cat >&2 <<TXT

  Trammel is starting on http://localhost:$PORT
  Demo accounts (password trammel-demo, local use only):
    admin@halvard.example  installer@halvard.example  inspector@halvard.example
    engineer@halvard.example  buyer@marlowcreek.example  buyer@tollan.example

TXT
# A local SMTP fake for the outbox (mail lands in .data/mail); Ctrl-C stops it with the app.
npx tsx lib/mail/fake-smtp.ts >.data/fake-smtp.log 2>&1 &
export SMTP_URL=${SMTP_URL:-smtp://127.0.0.1:2525}
exec npx next start -p "$PORT" -H "${HOST:-127.0.0.1}"
