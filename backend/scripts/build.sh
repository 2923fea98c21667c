#!/usr/bin/env bash
# Builds what is out of date: common, backend and seed with tsc, the front end with Vite.
set -euo pipefail
ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/../.." && pwd)"
cd "$ROOT"
stale() { # stale <output-file> <dir>...: true when the output is missing or older than any source file
  local out="$1"; shift
  [ ! -e "$out" ] && return 0
  [ -n "$(find "$@" -newer "$out" -type f -print -quit 2>/dev/null)" ]
}
if stale common/dist/index.js common/src common/tsconfig.json common/tsconfig.build.json; then
  echo "build: common"; npm run -s build -w common
fi
if stale seed/dist/index.js seed/src common/dist; then
  echo "build: seed"; npm run -s build -w seed
fi
if stale backend/dist/main.js backend/src common/dist seed/dist; then
  echo "build: backend"; npm run -s build -w backend
fi
if [ "${SKIP_FRONTEND_BUILD:-}" != 1 ] && stale frontend/dist/index.html frontend/src frontend/index.html frontend/vite.config.ts common/src; then
  echo "build: frontend"; npm run -s build -w frontend >/dev/null
fi
