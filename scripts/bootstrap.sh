# Sourced by start.sh and test.sh: installs what the project needs when it is missing, and nothing else.
set -euo pipefail
cd "$(dirname "${BASH_SOURCE[0]}")/.."

say() { printf 'keyloom: %s\n' "$*"; }

apt_updated=0
apt_install() {
  if [ "$(id -u)" != 0 ]; then
    say "missing Debian packages: $*; install them with: sudo apt-get install -y $*" >&2
    exit 1
  fi
  if [ "$apt_updated" = 0 ]; then
    say "reading Debian's package lists"
    apt-get update -qq
    apt_updated=1
  fi
  say "installing Debian packages: $*"
  DEBIAN_FRONTEND=noninteractive apt-get install -y -qq "$@" >/dev/null
}

# npm ci when node_modules is missing or was installed from another package-lock.json.
ensure_node_modules() {
  local stamp=node_modules/.keyloom-lock-sha256 want
  want=$(sha256sum package-lock.json | cut -d' ' -f1)
  if [ ! -f "$stamp" ] || [ "$(cat "$stamp")" != "$want" ]; then
    say "installing npm dependencies (npm ci)"
    npm ci --no-audit --no-fund --loglevel=error
    echo "$want" > "$stamp"
  fi
}

ensure_postgres() {
  if ! compgen -G '/usr/lib/postgresql/*/bin/postgres' >/dev/null; then
    apt_install postgresql
  fi
}

ensure_chromium() {
  if [ ! -x /usr/bin/chromium ]; then
    apt_install chromium
  fi
}

export NG_CLI_ANALYTICS=false
