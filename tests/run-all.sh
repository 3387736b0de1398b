#!/usr/bin/env bash
# npm test: the lint, unit and integration tests, then end-to-end tests against the built app in Chromium.
# The workbook test recalculates exported files in LibreOffice Calc; the e2e tests drive Chromium.
# Both come from Debian: installed here when running as root, otherwise the command is printed.
set -euo pipefail
cd "$(dirname "$0")/.."

need=()
command -v soffice >/dev/null 2>&1 || need+=(libreoffice-calc)
[ -x "${CHROMIUM_PATH:-/usr/bin/chromium}" ] || need+=(chromium)
if [ ${#need[@]} -gt 0 ]; then
  if [ "$(id -u)" = "0" ]; then
    echo "Installing Debian packages the tests need: ${need[*]}"
    apt-get update -qq && DEBIAN_FRONTEND=noninteractive apt-get install -y -qq "${need[@]}" >/dev/null
  else
    echo "The tests need Debian packages that are missing. Install them with:"
    echo "  sudo apt-get install -y ${need[*]}"
    exit 1
  fi
fi

# The lint first: an import running up a floor (DEVELOPERS.md) fails the run before any test.
npx eslint .
npx vitest run
npx vitest run --config vitest.e2e.config.mts
