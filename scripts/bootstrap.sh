#!/usr/bin/env bash
# Entry point of `npm start` and `npm test` on a fresh clone: installs the dependencies when they are
# missing or older than the lock file, then hands over to the TypeScript script of that name.
set -euo pipefail
cd "$(dirname "$0")/.."
mode="${1:?usage: bootstrap.sh start|test [args]}"
shift

if ! command -v node >/dev/null 2>&1; then
  echo "Isallo needs Node.js 20.19 or newer (node was not found on PATH)." >&2
  exit 1
fi

if [ ! -f node_modules/.package-lock.json ] || [ package-lock.json -nt node_modules/.package-lock.json ]; then
  echo "Installing dependencies (npm ci)…"
  npm ci --no-audit --no-fund
fi

exec node_modules/.bin/tsx "scripts/${mode}.ts" "$@"
