#!/usr/bin/env bash
# The README's second command: every test from nothing. Installs what is missing, starts a
# fresh PostgreSQL of its own (port 54339, under .data/test-pg, wiped first), runs the type check
# and lint, unit tests, integration tests against that PostgreSQL, builds the app, serves it on
# 127.0.0.1:3100 and runs the browser tests in Debian's Chromium, then the fault and scale-out
# tests (two instances on 3100/3101, PostgreSQL restarted) and a short PDF soak, then stops
# everything it started.
set -euo pipefail
ROOT=$(cd "$(dirname "$0")/.." && pwd)
cd "$ROOT"
export TMPDIR=$ROOT/.data/tmp XDG_CONFIG_HOME=$ROOT/.data/xdg XDG_CACHE_HOME=$ROOT/.data/xdg-cache
mkdir -p "$TMPDIR" .data/screenshots .data/test-results
# TEST_PORT_OFFSET moves every port (PostgreSQL, app, S3 and SMTP fakes) so that several
# checkouts on one machine can run their suites side by side; CI leaves it at 0.
OFF=${TEST_PORT_OFFSET:-0}
export PGPORT=$((54339 + OFF)) PG_BASE=$ROOT/.data/test-pg
unset DATABASE_URL
APP_PORT=$((3100 + OFF))
S3_PORT=$((4570 + OFF)) SMTP_PORT=$((2526 + OFF))
t0=$(date +%s)
step() { echo; echo "== $* ($(( $(date +%s) - t0 )) s)"; }

cleanup() {
  [ -f .data/test-s3.pid ] && kill -- -"$(cat .data/test-s3.pid)" 2>/dev/null || true
  rm -f .data/test-s3.pid
  [ -f .data/test-app.pid ] && kill -- -"$(cat .data/test-app.pid)" 2>/dev/null || true
  rm -f .data/test-app.pid
  [ -f .data/test-smtp.pid ] && kill -- -"$(cat .data/test-smtp.pid)" 2>/dev/null || true
  rm -f .data/test-smtp.pid
  DATABASE_URL= bash db/pg.sh stop || true
}
trap cleanup EXIT

step "dependencies"
bash lib/scripts/ensure-deps.sh --browser

# The geometry CLI runs from a bundle made at build time (lib/cli/build.mjs), never at run time.
npm run -s build:cli

step "fresh PostgreSQL on 127.0.0.1:$PGPORT"
bash db/pg.sh stop >/dev/null 2>&1 || true
rm -rf "$PG_BASE"
bash db/pg.sh start

step "type check and lint"
npx tsc --noEmit -p .
npx eslint --max-warnings=0 .
npx prettier --check . >/dev/null || { npx prettier --check . | tail -20; echo "formatting differs: run npm run format"; exit 1; }

step "unit and integration tests"
DATABASE_URL=$(bash db/pg.sh url trammel_test) npx vitest run --project unit --project integration \
  --reporter=default --reporter=json --outputFile=.data/test-results/vitest.json

step "build and serve the app for browser tests"
export DATABASE_URL=$(bash db/pg.sh url trammel_e2e)
# The address printed on the seeded and issued reports (and required by next start in production).
export PUBLIC_URL=http://127.0.0.1:$APP_PORT
# Uploaded originals go to s3rver on loopback (its own port and folder, wiped, so a running demo is untouched).
rm -rf .data/test-s3
S3_PORT=$S3_PORT S3_DIR=.data/test-s3 setsid npx tsx lib/storage/dev-s3.ts >.data/test-s3.log 2>&1 &
echo $! >.data/test-s3.pid
export STORAGE_DRIVER=s3 S3_ENDPOINT=http://127.0.0.1:$S3_PORT
for _ in $(seq 60); do curl -s -o /dev/null "$S3_ENDPOINT" && break; sleep 0.25; done
npm run -s db:migrate
npm run -s db:seed
NEXT_SKIP_TYPECHECK=1 NEXT_DIST_DIR=.next-test npx next build >.data/test-build.log 2>&1 || { tail -60 .data/test-build.log; exit 1; }
# The app's outbox worker sends to a local SMTP fake of its own (mail lands in .data/test-mail).
rm -rf .data/test-mail
MAIL_DIR=.data/test-mail SMTP_FAKE_PORT=$SMTP_PORT setsid npx tsx lib/mail/fake-smtp.ts >.data/test-smtp.log 2>&1 &
echo $! >.data/test-smtp.pid
SMTP_URL=smtp://127.0.0.1:$SMTP_PORT NEXT_DIST_DIR=.next-test NEXTAUTH_URL=http://127.0.0.1:$APP_PORT setsid npx next start -p $APP_PORT -H 127.0.0.1 >.data/test-app.log 2>&1 &
echo $! >.data/test-app.pid
for _ in $(seq 60); do curl -sf "http://127.0.0.1:$APP_PORT/api/health" >/dev/null && break; sleep 0.5; done
curl -sf "http://127.0.0.1:$APP_PORT/api/health" >/dev/null || { echo "the app did not start:"; tail -40 .data/test-app.log; exit 1; }

step "browser tests (Debian Chromium)"
E2E_MAIL_DIR=$ROOT/.data/test-mail E2E_BASE_URL=http://127.0.0.1:$APP_PORT npx vitest run --project e2e \
  --reporter=default --reporter=json --outputFile=.data/test-results/e2e.json

step "faults and scale-out (two instances, SMTP fake stopped, PostgreSQL restarted)"
# The browser tests' app and SMTP fake make way: the fault tests start their own two instances
# (ports 3100 and 3101) of the same build on a database of their own, with their own SMTP fake,
# and restart this PostgreSQL. Failures are counted in the summary.
kill -- -"$(cat .data/test-app.pid)" 2>/dev/null || true; rm -f .data/test-app.pid
kill -- -"$(cat .data/test-smtp.pid)" 2>/dev/null || true; rm -f .data/test-smtp.pid
rm -f .data/test-results/faults.json
faults_t0=$(date +%s)
FAULTS_DB_URL=$(DATABASE_URL= bash db/pg.sh url trammel_faults) FAULTS_PORTS=$APP_PORT,$((APP_PORT + 1)) FAULTS_SMTP_PORT=$((SMTP_PORT + 1)) \
  NEXT_DIST_DIR=.next-test npx vitest run --project faults \
  --reporter=default --reporter=json --outputFile=.data/test-results/faults.json || true
# PDF renderer soak: a short run here (a leak of 0.4 MB per render fails it); npm run bench:pdf-soak runs the full 500.
NODE_ENV=production SOAK_RENDERS=25 SOAK_WARMUP=3 SOAK_MAX_GROWTH_MB=10 npx tsx --expose-gc tests/bench/pdf-soak.ts \
  >.data/test-results/pdf-soak.json || true
cat .data/test-results/pdf-soak.json
echo "faults stage: $(( $(date +%s) - faults_t0 )) s"

step "summary"
node -e '
  const fs = require("fs");
  let p = 0, f = 0, s = 0;
  for (const file of [".data/test-results/vitest.json", ".data/test-results/e2e.json", ".data/test-results/faults.json"]) {
    const r = JSON.parse(fs.readFileSync(file, "utf8"));
    p += r.numPassedTests; f += r.numFailedTests; s += r.numPendingTests + (r.numTodoTests || 0);
  }
  // The soak counts as one check: its script prints the figure and ok.
  let soak = { ok: false };
  try { soak = JSON.parse(fs.readFileSync(".data/test-results/pdf-soak.json", "utf8")); } catch {}
  if (soak.ok) p++; else { f++; console.log("PDF soak failed or did not finish (see above)"); }
  console.log(`screenshots in .data/screenshots; total time ${process.argv[1]} s`);
  console.log(`${p} passed, ${f} failed, ${s} skipped`);
  process.exit(f > 0 ? 1 : 0);
' "$(( $(date +%s) - t0 ))"
