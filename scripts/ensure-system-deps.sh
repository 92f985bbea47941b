#!/usr/bin/env bash
# The end-to-end tests need Debian's Chromium and poppler-utils (pdftoppm).
# Installs them when missing and we may (root with apt-get); otherwise says what to install.
set -euo pipefail
need=()
[ -x "${CHROMIUM_PATH:-/usr/bin/chromium}" ] || need+=(chromium)
command -v pdftoppm >/dev/null 2>&1 || need+=(poppler-utils)
[ ${#need[@]} -eq 0 ] && exit 0
if [ "$(id -u)" = 0 ] && command -v apt-get >/dev/null 2>&1; then
  echo "Installing ${need[*]} (first run only)…"
  export DEBIAN_FRONTEND=noninteractive
  apt-get update -qq
  apt-get install -y -qq "${need[@]}" >/dev/null
else
  echo "The end-to-end tests need: ${need[*]}. Install them (Debian: sudo apt-get install ${need[*]}) or set CHROMIUM_PATH." >&2
  exit 1
fi
