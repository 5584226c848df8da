#!/usr/bin/env bash
# Installs the system packages the tests need on a fresh Debian machine (run as root there):
# fonts for text in PNG charts, Chromium for the report's browser test, and nbconvert/nbclient
# to execute the notebooks headlessly. Already-installed packages are skipped quickly.
set -euo pipefail
need=()
[ -e /usr/share/fonts/truetype/dejavu/DejaVuSans.ttf ] || need+=(fonts-dejavu-core)
command -v chromium >/dev/null 2>&1 || need+=(chromium)
command -v jupyter-nbconvert >/dev/null 2>&1 || need+=(jupyter-nbconvert)
/usr/bin/python3 -c 'import nbclient' >/dev/null 2>&1 || need+=(python3-nbclient)
if [ ${#need[@]} -gt 0 ]; then
  if [ "$(id -u)" != 0 ]; then
    echo "test setup: missing system packages ${need[*]}; install them with apt-get as root" >&2
    exit 1
  fi
  echo "test setup: installing ${need[*]}" >&2
  export DEBIAN_FRONTEND=noninteractive
  apt-get update -qq >/dev/null
  apt-get install -y -qq --no-install-recommends "${need[@]}" >/dev/null
fi
