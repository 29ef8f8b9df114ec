# Shared steps for `npm start` and `npm test`. Sourced, not run.
ROOT_DIR="$(cd "$(dirname "${BASH_SOURCE[0]}")/../.." && pwd)"
cd "$ROOT_DIR"
export NEXT_TELEMETRY_DISABLED=1
if [ -f .env ]; then set -a; . ./.env; set +a; fi

log() { printf '\033[1m[lobewise]\033[0m %s\n' "$*"; }

# Hash of the files that decide an input, so a step reruns only when they change.
tree_hash() {
  { for path in "$@"; do
      if [ -d "$path" ]; then find "$path" -type f -not -path '*/node_modules/*' -print0 | sort -z | xargs -0 sha256sum;
      elif [ -f "$path" ]; then sha256sum "$path"; fi
    done; } | sha256sum | cut -d' ' -f1
}

ensure_dependencies() {
  local want have=""
  want="$(tree_hash package-lock.json)"
  [ -f node_modules/.lobewise-lock-hash ] && have="$(cat node_modules/.lobewise-lock-hash)"
  if [ ! -d node_modules ] || [ "$want" != "$have" ]; then
    log "installing dependencies (npm ci)…"
    npm ci --no-audit --no-fund
    echo "$want" > node_modules/.lobewise-lock-hash
  fi
}

ensure_build() {
  local want have=""
  want="$(tree_hash src public database/config.cjs next.config.mjs tailwind.config.ts postcss.config.mjs tsconfig.json package-lock.json)"
  [ -f .next/lobewise-build-hash ] && have="$(cat .next/lobewise-build-hash)"
  if [ ! -f .next/BUILD_ID ] || [ "$want" != "$have" ]; then
    log "building the app (next build)…"
    npx next build
    echo "$want" > .next/lobewise-build-hash
  else
    log "build is up to date"
  fi
}

start_database() {
  bash docker-local/mariadb/start
}

sql_as_app() {
  mariadb --no-defaults -h "${DB_HOST:-127.0.0.1}" -P "${DB_PORT:-3407}" -u "${DB_USER:-lobewise}" -p"${DB_PASSWORD:-lobewise-local}" "$@"
}
