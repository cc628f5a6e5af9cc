#!/usr/bin/env bash
# The whole test suite, as the README's test command and CI run it. It installs what it needs first.
set -uo pipefail
cd "$(dirname "$0")/.."

step() { printf '\n\033[1m== %s ==\033[0m\n' "$1"; }

step "system packages (chromium, ffmpeg)"
missing=()
command -v chromium >/dev/null 2>&1 || [ -x /usr/bin/chromium ] || missing+=(chromium)
command -v ffmpeg >/dev/null 2>&1 || missing+=(ffmpeg)
if [ ${#missing[@]} -gt 0 ]; then
  if [ "$(id -u)" = "0" ] && command -v apt-get >/dev/null 2>&1; then
    export DEBIAN_FRONTEND=noninteractive
    apt-get update -qq && apt-get install -y -qq "${missing[@]}" >/dev/null || { echo "apt-get install ${missing[*]} failed"; exit 1; }
  else
    echo "Missing: ${missing[*]}. Install them with: sudo apt-get install -y ${missing[*]}"
    exit 1
  fi
fi
echo "chromium: $(/usr/bin/chromium --version 2>/dev/null | head -1); ffmpeg: $(ffmpeg -version 2>/dev/null | head -1 | cut -d' ' -f1-3)"

step "npm packages"
if [ ! -f node_modules/.package-lock.json ] || [ package-lock.json -nt node_modules/.package-lock.json ] || [ -n "${CI:-}" ]; then
  npm ci --no-audit --no-fund || { echo "npm ci failed"; exit 1; }
else
  echo "node_modules is up to date with package-lock.json"
fi

failures=0
run() { local name=$1; shift; step "$name"; if "$@"; then echo "[$name] ok"; else echo "[$name] FAILED"; failures=$((failures + 1)); fi; }

mkdir -p .artifacts/test-results
run "type check" npx tsc --noEmit -p tsconfig.json
run "lint" npx eslint . --max-warnings=0
run "build client" npx vite build --logLevel warn
for project in unit api e2e load; do
  run "$project tests" npx vitest run --project "$project" --passWithNoTests --reporter=default --reporter=json \
    --outputFile.json=".artifacts/test-results/$project.json"
done

step "summary"
node scripts/test-summary.mjs .artifacts/test-results "$failures"
