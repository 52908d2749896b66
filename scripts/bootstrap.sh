#!/bin/sh
# Installs what a fresh Debian machine lacks before any TypeScript can run:
# Debian packages (MariaDB, and Chromium for browser tests) and the npm dependencies.
# Usage: scripts/bootstrap.sh [--with-browser]
set -e
cd "$(dirname "$0")/.."

need_apt=""
find_bin() { command -v "$1" >/dev/null 2>&1 || [ -x "/usr/sbin/$1" ] || [ -x "/usr/bin/$1" ]; }

if [ -z "$DATABASE_URL" ] && ! find_bin mariadbd; then need_apt="$need_apt mariadb-server"; fi
if [ "$1" = "--with-browser" ] && [ ! -x /usr/bin/chromium ]; then need_apt="$need_apt chromium"; fi

if [ -n "$need_apt" ]; then
  if [ "$(id -u)" != "0" ] || ! command -v apt-get >/dev/null 2>&1; then
    echo "Lampwright needs these Debian packages:$need_apt" >&2
    echo "Install them as root with: apt-get update && apt-get install -y$need_apt" >&2
    exit 1
  fi
  echo "Installing Debian packages:$need_apt"
  export DEBIAN_FRONTEND=noninteractive
  apt-get update -qq
  # shellcheck disable=SC2086
  apt-get install -y -qq --no-install-recommends $need_apt >/dev/null
fi

# npm ci when node_modules is missing or was installed from another lock file.
stamp=node_modules/.lampwright-lock
want=$(sha1sum package-lock.json | cut -d' ' -f1)
have=$(cat "$stamp" 2>/dev/null || true)
if [ ! -d node_modules ] || [ "$want" != "$have" ]; then
  echo "Installing npm dependencies (npm ci)..."
  npm ci --no-audit --no-fund --loglevel=error
  echo "$want" > "$stamp"
fi
