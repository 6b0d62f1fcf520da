# Shared settings for scripts/start.sh and scripts/test.sh. Source it; do not run it.
set -euo pipefail
ROOT=$(cd "$(dirname "${BASH_SOURCE[0]}")/../.." && pwd)
cd "$ROOT"
export NUXT_TELEMETRY_DISABLED=1

log() { printf '\033[36m[veerline]\033[0m %s\n' "$*"; }
die() { printf '\033[31m[veerline] %s\033[0m\n' "$*" >&2; exit 1; }

ensure_node_modules() {
  if [ ! -d node_modules ] || [ ! -x node_modules/.bin/nuxt ]; then
    log "installing node modules (npm ci)"
    npm ci --no-audit --no-fund
  fi
  # Lint and type check read Nuxt's generated config; npm ci makes it (postinstall), a copied node_modules does not.
  if [ ! -f .nuxt/eslint.config.mjs ]; then
    log "generating Nuxt's types and configs (nuxt prepare)"
    node_modules/.bin/nuxt prepare >/dev/null
  fi
}

apt_ready=0
apt_install() {
  if [ "$apt_ready" = 0 ]; then
    log "apt-get update"
    DEBIAN_FRONTEND=noninteractive apt-get update -qq
    apt_ready=1
  fi
  log "apt-get install $*"
  DEBIAN_FRONTEND=noninteractive apt-get install -y -qq "$@" >/dev/null
}

ensure_mariadb_installed() {
  command -v mariadbd >/dev/null 2>&1 || [ -x /usr/sbin/mariadbd ] || apt_install mariadb-server
  export PATH="$PATH:/usr/sbin"
}

ensure_chromium_installed() {
  command -v chromium >/dev/null 2>&1 || apt_install chromium
}

# Random secret kept in a file under the data folder, made on first use.
kept_secret() {
  local file=$1
  if [ ! -s "$file" ]; then
    mkdir -p "$(dirname "$file")"
    (umask 077; node -e "process.stdout.write(require('crypto').randomBytes(32).toString('hex'))" > "$file")
  fi
  cat "$file"
}
