#!/usr/bin/env bash
# npm run bench: prints the speed figures of the wind engine (no timed tests anywhere else).
source "$(dirname "$0")/lib/common.sh"
ensure_node_modules
for f in bench/*.ts; do
  log "bench: $f"
  node_modules/.bin/tsx "$f"
done
