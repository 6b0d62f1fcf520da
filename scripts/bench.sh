#!/usr/bin/env bash
# npm run bench: the wind engine's speed figures, the alert fan-out figures and the HTTP load benchmark (no timed
# tests anywhere else). A bench/<name>.ts that needs a server and a database has a life-cycle script of its own,
# scripts/bench-<name>.sh, which starts them, runs it and stops them; the others run directly.
source "$(dirname "$0")/lib/common.sh"
ensure_node_modules
for f in bench/*.ts; do
  name=$(basename "$f" .ts)
  if [ -f "scripts/bench-$name.sh" ]; then
    log "bench: $f (through scripts/bench-$name.sh)"
    bash "scripts/bench-$name.sh"
  else
    log "bench: $f"
    node_modules/.bin/tsx "$f"
  fi
done
log "bench: HTTP load (scripts/bench-http.sh)"
bash scripts/bench-http.sh
