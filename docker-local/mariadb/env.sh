# Shared settings for the project's private MariaDB. Sourced by start/stop/status.
# Everything lives under var/ (gitignored) so Tailwind and Next never see the data or the socket.
ROOT_DIR="$(cd "$(dirname "${BASH_SOURCE[0]}")/../.." && pwd)"
if [ -f "$ROOT_DIR/.env" ]; then set -a; . "$ROOT_DIR/.env"; set +a; fi
DB_HOST="${DB_HOST:-127.0.0.1}"
DB_PORT="${DB_PORT:-3407}"
DB_USER="${DB_USER:-lobewise}"
DB_PASSWORD="${DB_PASSWORD:-lobewise-local}"
DB_NAMES="${DB_NAMES:-lobewise_dev lobewise_test}"
MARIADB_DIR="${MARIADB_DIR:-$ROOT_DIR/var/mariadb}"
DATA_DIR="$MARIADB_DIR/data"
PID_FILE="$MARIADB_DIR/mariadbd.pid"
LOG_FILE="$MARIADB_DIR/error.log"
SOCKET="$MARIADB_DIR/mariadbd.sock"
# Unix sockets are limited to ~107 bytes; a deep clone path falls back to /tmp.
if [ "${#SOCKET}" -gt 100 ]; then SOCKET="/tmp/lobewise-mariadb-$DB_PORT.sock"; fi

server_running() {
  [ -f "$PID_FILE" ] && kill -0 "$(cat "$PID_FILE")" 2>/dev/null
}
root_sql() {
  mariadb --no-defaults --socket="$SOCKET" -uroot "$@"
}
