# Shared helpers for the start/test/worker scripts. Sourced, not run.
REPO=$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)
export TURBO_TELEMETRY_DISABLED=1 TURBO_NO_UPDATE_NOTIFIER=1 NEXT_TELEMETRY_DISABLED=1

say() { printf '\033[1;36m▸\033[0m %s\n' "$*"; }

# Install node_modules with `npm ci` when missing or when package-lock.json changed since the last install.
ensure_deps() {
  local stamp="$REPO/node_modules/.sigmatail-lock-hash" want
  want=$(sha256sum "$REPO/package-lock.json" | cut -d' ' -f1)
  if [ ! -d "$REPO/node_modules" ] || [ "$(cat "$stamp" 2>/dev/null)" != "$want" ]; then
    say "installing dependencies (npm ci)…"
    (cd "$REPO" && npm ci --no-audit --no-fund --loglevel=error)
    echo "$want" > "$stamp"
  fi
}

# Debian chromium for the browser tests, installed once when missing.
ensure_chromium() {
  [ -x /usr/bin/chromium ] && return 0
  if [ "$(id -u)" = 0 ]; then
    say "installing Debian chromium for the browser tests (one time, ~1.5 min)…"
    apt-get update -qq && DEBIAN_FRONTEND=noninteractive apt-get install -y -qq chromium >/dev/null
  else
    echo "chromium is missing: run 'sudo apt-get install -y chromium'" >&2; return 1
  fi
}

tsx_() { "$REPO/node_modules/.bin/tsx" --conditions=@sigmatail/source "$@"; }
