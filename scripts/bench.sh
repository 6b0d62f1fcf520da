#!/usr/bin/env bash
# npm run bench: the wind engine's speed figures, then the HTTP load benchmark (no timed tests anywhere else).
source "$(dirname "$0")/lib/common.sh"
ensure_node_modules
for f in bench/*.ts; do
  log "bench: $f"
  node_modules/.bin/tsx "$f"
done
log "bench: HTTP load (scripts/bench-http.sh)"
bash scripts/bench-http.sh
