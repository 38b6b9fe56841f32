#!/usr/bin/env bash
# Entry point of `npm start`, `npm test`, `npm run dev` and `npm run bench`:
# installs what is missing (Debian packages, npm dependencies), then hands over
# to the TypeScript script of that mode. Safe to run again: each step is skipped
# when its result is already there.
set -euo pipefail
cd "$(dirname "$0")/.."
mode="${1:?usage: bootstrap.sh start|test|dev|bench}"

# Debian packages: private database and queue servers, ERFA (time scales and
# Earth orientation), the DE405 ephemeris and Chromium for the browser tests.
packages=(mariadb-server mariadb-client redis-server liberfa1 casacore-data-jpl-de405 chromium)
missing=()
for p in "${packages[@]}"; do
  dpkg-query -W -f='${Status}' "$p" 2>/dev/null | grep -q "install ok installed" || missing+=("$p")
done
if [ ${#missing[@]} -gt 0 ]; then
  echo "Installing Debian packages: ${missing[*]}"
  sudo_cmd=()
  [ "$(id -u)" -eq 0 ] || sudo_cmd=(sudo)
  "${sudo_cmd[@]}" apt-get update -qq
  DEBIAN_FRONTEND=noninteractive "${sudo_cmd[@]}" apt-get install -y -qq --no-install-recommends "${missing[@]}"
fi

# npm dependencies, exactly as locked; reinstalled only when the lock file changed.
stamp=node_modules/.pulsekeeper-lock.sha256
want=$(sha256sum package-lock.json | cut -d' ' -f1)
if [ ! -f "$stamp" ] || [ "$(cat "$stamp")" != "$want" ]; then
  echo "Installing npm dependencies (npm ci)"
  npm ci --no-audit --no-fund --loglevel=error
  echo "$want" > "$stamp"
fi

export TMPDIR="${TMPDIR:-$PWD/.data/tmp}"
mkdir -p "$TMPDIR"
exec node_modules/.bin/tsx "scripts/$mode.ts" "${@:2}"
