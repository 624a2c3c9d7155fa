#!/usr/bin/env bash
# Entry point of `npm start`, `npm test` and `npm run bench`. Bash, because it
# has to run before the npm packages (tsx among them) are installed.
set -euo pipefail

cmd="${1:-}"
case "$cmd" in
  start | test | bench) shift ;;
  *)
    echo "usage: bash scripts/bootstrap.sh <start|test|bench> [options]" >&2
    exit 2
    ;;
esac

cd "$(dirname "${BASH_SOURCE[0]}")/.."

if ! command -v node >/dev/null 2>&1 || ! command -v npm >/dev/null 2>&1; then
  echo "Scrap Relay needs Node.js 20.19 or newer (with npm) on PATH." >&2
  echo "On Debian/Ubuntu: install Node 20 from https://nodejs.org or your distribution, then run this again." >&2
  exit 1
fi

# Same range as "engines" in package.json: Vite 8 needs 20.19+, and 21 is not supported.
node_version="$(node -p 'process.versions.node')"
IFS=. read -r node_major node_minor _ <<<"$node_version"
if ((node_major < 20 || (node_major == 20 && node_minor < 19) || node_major == 21)); then
  echo "Scrap Relay needs Node.js 20.19+ or 22+; this machine has $node_version." >&2
  exit 1
fi

# npm writes node_modules/.package-lock.json on every install, so it marks
# when the installed tree last matched package-lock.json.
if [[ ! -d node_modules || ! -f node_modules/.package-lock.json || package-lock.json -nt node_modules/.package-lock.json ]]; then
  echo "Installing npm packages (npm ci)…"
  npm ci --no-audit --no-fund
fi

exec node_modules/.bin/tsx "scripts/$cmd.ts" "$@"
