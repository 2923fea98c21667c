#!/usr/bin/env bash
# The Debian packages Amberline's scripts run: PostgreSQL's server (npm start, npm test) and Chromium (the browser
# tests). usage: system-deps.sh postgresql [chromium]
# As root with apt-get: installs what is missing (unless SYSTEM_DEPS_INSTALL=no). Otherwise: says exactly what to
# install and fails.
set -euo pipefail
missing=()
for what in "$@"; do
  case "$what" in
    postgresql)
      if ! { command -v pg_config >/dev/null 2>&1 && [ -x "$(pg_config --bindir)/initdb" ]; } && ! ls /usr/lib/postgresql/*/bin/initdb >/dev/null 2>&1; then
        missing+=(postgresql)
      fi ;;
    chromium)
      [ -x "${CHROMIUM_PATH:-/usr/bin/chromium}" ] || missing+=(chromium) ;;
    *) echo "system-deps: unknown package $what" >&2; exit 2 ;;
  esac
done
[ ${#missing[@]} -eq 0 ] && exit 0
if [ "$(id -u)" = 0 ] && command -v apt-get >/dev/null 2>&1 && [ "${SYSTEM_DEPS_INSTALL:-yes}" != no ]; then
  echo "amberline: installing Debian packages: ${missing[*]} (once; a few minutes)"
  export DEBIAN_FRONTEND=noninteractive
  apt-get update -qq
  apt-get install -y -qq "${missing[@]}" >/dev/null
  exit 0
fi
echo "amberline: missing Debian packages: ${missing[*]}" >&2
echo "  install them with:  sudo apt-get install -y ${missing[*]}" >&2
[[ " ${missing[*]} " == *" chromium "* ]] && echo "  (or point CHROMIUM_PATH at a Chromium or Chrome binary)" >&2
exit 1
