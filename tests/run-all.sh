#!/usr/bin/env bash
# npm test: unit and integration tests, then end-to-end tests against the built app in Chromium.
set -euo pipefail
cd "$(dirname "$0")/.."

npx vitest run

if [ ! -x "${CHROMIUM_PATH:-/usr/bin/chromium}" ]; then
  if [ "$(id -u)" = "0" ]; then
    echo "Chromium is missing: installing Debian's chromium package for the end-to-end tests."
    apt-get update -qq && DEBIAN_FRONTEND=noninteractive apt-get install -y -qq chromium >/dev/null
  else
    echo "The end-to-end tests need Debian's Chromium. Install it with:"
    echo "  sudo apt-get install -y chromium"
    exit 1
  fi
fi

npx vitest run --config vitest.e2e.config.mts
