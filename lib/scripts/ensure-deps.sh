#!/usr/bin/env bash
# Installs what a fresh machine is missing, and nothing it already has:
#   - npm packages (npm ci, when node_modules is absent or package-lock.json changed)
#   - with --browser: Debian's chromium (browser tests) and poppler-utils (PDF checks)
# PostgreSQL is installed by db/pg.sh when it starts the cluster.
set -euo pipefail
ROOT=$(cd "$(dirname "$0")/../.." && pwd)
cd "$ROOT"
mkdir -p .data

lock_sum=$(sha256sum package-lock.json | cut -c1-64)
if [ ! -d node_modules ] || [ "$(cat .data/npm-lock.sha 2>/dev/null)" != "$lock_sum" ]; then
  echo "ensure-deps: installing npm packages (npm ci)…" >&2
  npm ci --no-audit --no-fund --loglevel=error
  echo "$lock_sum" >.data/npm-lock.sha
fi

apt_install() {
  if [ "$(id -u)" != 0 ]; then echo "ensure-deps: missing Debian packages ($*) and not root; install them with apt-get." >&2; exit 1; fi
  echo "ensure-deps: installing Debian packages: $*" >&2
  apt-get -o DPkg::Lock::Timeout=900 update -qq
  DEBIAN_FRONTEND=noninteractive apt-get -o DPkg::Lock::Timeout=900 install -y -qq --no-install-recommends --no-upgrade "$@" >/dev/null
}

if [ "${1:-}" = "--browser" ]; then
  need=()
  [ -x /usr/bin/chromium ] || need+=(chromium)
  command -v pdftoppm >/dev/null || need+=(poppler-utils)
  [ ${#need[@]} -eq 0 ] || apt_install "${need[@]}"
fi

# The session secret lives outside git, made once per checkout.
if [ ! -s .env.local ] || ! grep -q '^NEXTAUTH_SECRET=' .env.local; then
  echo "NEXTAUTH_SECRET=$(node -e 'console.log(require("crypto").randomBytes(32).toString("hex"))')" >>.env.local
fi
