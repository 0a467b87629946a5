#!/usr/bin/env bash
# Local services for Ketwise, on 127.0.0.1 only, data under .data/ (git-ignored):
#   MariaDB  (port $MARIADB_PORT, default 3307)   Redis (port $REDIS_PORT, 6380, AOF on)
#   maildev  (SMTP $SMTP_PORT 1025, web/API $MAIL_WEB_PORT 1080)
#   payment fake (port $PAYMENT_FAKE_PORT 12111, when docker/payment-fake/server.ts exists)
# Usage: scripts/services.sh start [--browser] | stop | status | install [--browser]
#        scripts/services.sh reset-db ketwise_test   (drop + create an app database)
# Starting twice is harmless; a missing Debian package is installed with apt-get.
set -euo pipefail
source "$(dirname "${BASH_SOURCE[0]}")/lib/common.sh"

MY_DIR="$DATA_DIR/mariadb"
MY_CNF="$MY_DIR/my.cnf"
REDIS_DIR="$DATA_DIR/redis"
RUN_DIR="$DATA_DIR/run"

socket_path() {
  local s="$MY_DIR/mysqld.sock"
  # Unix socket paths over ~107 bytes fail; fall back to a short, per-checkout one.
  if ((${#s} > 100)); then s="/tmp/ketwise-$(printf '%s' "$ROOT" | cksum | cut -d' ' -f1).sock"; fi
  printf '%s' "$s"
}

apt_install() {
  log "installing Debian packages: $*"
  if [[ $EUID -ne 0 ]]; then die "need root to apt-get install $* (run as root or install them yourself)"; fi
  export DEBIAN_FRONTEND=noninteractive
  apt-get update -qq || die "apt-get update failed — cannot install $*. Check the network/apt sources."
  apt-get install -y -qq --no-install-recommends "$@" || die "apt-get install $* failed."
}

install_packages() {
  local want=()
  [[ -x /usr/sbin/mariadbd || -n $(command -v mariadbd) ]] || want+=(mariadb-server)
  command -v mariadb >/dev/null 2>&1 || want+=(mariadb-client)
  command -v redis-server >/dev/null 2>&1 || want+=(redis-server)
  if [[ ${1:-} == --browser ]] && ! [[ -x /usr/bin/chromium ]]; then want+=(chromium); fi
  if ((${#want[@]})); then apt_install "${want[@]}"; fi
  if [[ ! -d "$ROOT/node_modules" || "$ROOT/package-lock.json" -nt "$ROOT/node_modules/.package-lock.json" ]]; then
    log "installing npm packages (npm ci)"
    (cd "$ROOT" && npm ci --no-audit --no-fund) || die "npm ci failed"
  fi
}

# ---------------------------------------------------------------- MariaDB
write_my_cnf() {
  mkdir -p "$MY_DIR/data"
  cat >"$MY_CNF" <<CNF
[client-server]
socket=$(socket_path)
port=$MARIADB_PORT

[mariadbd]
user=root
datadir=$MY_DIR/data
pid-file=$MY_DIR/mariadbd.pid
log-error=$MY_DIR/error.log
bind-address=127.0.0.1
skip-name-resolve
skip-log-bin
character-set-server=utf8mb4
collation-server=utf8mb4_unicode_ci
default-time-zone=+00:00
innodb_buffer_pool_size=128M
innodb_flush_log_at_trx_commit=2
max_connections=300
CNF
}

maria_ping() { mariadb-admin --defaults-file="$MY_CNF" --silent ping >/dev/null 2>&1; }

start_mariadb() {
  write_my_cnf
  if maria_ping; then log "MariaDB already running on 127.0.0.1:$MARIADB_PORT"; else
    if [[ ! -d "$MY_DIR/data/mysql" ]]; then
      log "initialising MariaDB data directory"
      mariadb-install-db --defaults-file="$MY_CNF" --user=root \
        --auth-root-authentication-method=socket --skip-test-db >"$MY_DIR/install.log" 2>&1 ||
        die "mariadb-install-db failed; see $MY_DIR/install.log"
    fi
    if port_open "$MARIADB_PORT"; then die "port $MARIADB_PORT is taken by another program (set MARIADB_PORT)"; fi
    setsid nohup mariadbd --defaults-file="$MY_CNF" >/dev/null 2>&1 &
    wait_for 60 MariaDB maria_ping || die "MariaDB did not start; see $MY_DIR/error.log"
    log "MariaDB started on 127.0.0.1:$MARIADB_PORT"
  fi
  local pw="${DB_PASSWORD//\'/\'\'}" sql=""
  for db in "$DB_NAME" "${DB_NAME}_test" "${DB_NAME}_bench"; do
    sql+="CREATE DATABASE IF NOT EXISTS \`$db\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;"
  done
  for host in 127.0.0.1 localhost; do
    sql+="CREATE USER IF NOT EXISTS '$DB_USER'@'$host' IDENTIFIED BY '$pw';"
    sql+="ALTER USER '$DB_USER'@'$host' IDENTIFIED BY '$pw';"
    sql+="GRANT ALL PRIVILEGES ON \`$DB_NAME\`.* TO '$DB_USER'@'$host';"
    sql+="GRANT ALL PRIVILEGES ON \`${DB_NAME}_test\`.* TO '$DB_USER'@'$host';"
    sql+="GRANT ALL PRIVILEGES ON \`${DB_NAME}_bench\`.* TO '$DB_USER'@'$host';"
  done
  mariadb --defaults-file="$MY_CNF" -u root -e "$sql" || die "could not create the app user and databases"
}

stop_mariadb() {
  if maria_ping; then
    mariadb-admin --defaults-file="$MY_CNF" shutdown && log "MariaDB stopped"
  fi
}

# Drops and recreates one of the app's databases (only <name>, <name>_test or <name>_bench).
reset_database() {
  local db="$1"
  [[ $db == "$DB_NAME" || $db == "${DB_NAME}_test" || $db == "${DB_NAME}_bench" ]] || die "refusing to reset unknown database $db"
  write_my_cnf
  maria_ping || die "MariaDB is not running (scripts/services.sh start)"
  mariadb --defaults-file="$MY_CNF" -u root -e \
    "DROP DATABASE IF EXISTS \`$db\`; CREATE DATABASE \`$db\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;"
  log "database $db is empty"
}

# ---------------------------------------------------------------- Redis
redis_ping() { [[ $(redis-cli -p "$REDIS_PORT" ping 2>/dev/null) == PONG ]]; }

start_redis() {
  if redis_ping; then log "Redis already running on 127.0.0.1:$REDIS_PORT"; return; fi
  mkdir -p "$REDIS_DIR"
  redis-server --bind 127.0.0.1 --port "$REDIS_PORT" --dir "$REDIS_DIR" --appendonly yes \
    --save "" --daemonize yes --pidfile "$REDIS_DIR/redis.pid" --logfile "$REDIS_DIR/redis.log" \
    --maxmemory-policy noeviction >/dev/null
  wait_for 30 Redis redis_ping || die "Redis did not start; see $REDIS_DIR/redis.log"
  log "Redis started on 127.0.0.1:$REDIS_PORT"
}

stop_redis() { if redis_ping; then redis-cli -p "$REDIS_PORT" shutdown >/dev/null 2>&1 || true; log "Redis stopped"; fi; }

# ---------------------------------------------------------------- node services
# start_node_service NAME HEALTH_URL COMMAND... — background process, pid in .data/run/NAME.pid
start_node_service() {
  local name="$1" url="$2"
  shift 2
  if http_ok "$url"; then log "$name already running"; return; fi
  mkdir -p "$RUN_DIR"
  # The process records its own pid after setsid (which may fork), so stop can kill its group.
  (cd "$ROOT" && setsid nohup bash -c 'echo $$ >"$0"; exec "$@"' "$RUN_DIR/$name.pid" "$@" \
    >"$RUN_DIR/$name.log" 2>&1 &)
  wait_for 30 "$name" http_ok "$url" || die "$name did not start; see $RUN_DIR/$name.log"
  log "$name started ($url)"
}

stop_node_service() {
  local pidfile="$RUN_DIR/$1.pid"
  [[ -f $pidfile ]] || return 0
  local pid
  pid="$(cat "$pidfile")"
  if kill -0 "$pid" 2>/dev/null; then
    kill -- "-$pid" 2>/dev/null || kill "$pid" 2>/dev/null || true
    local deadline=$((SECONDS + 10))
    while kill -0 "$pid" 2>/dev/null && ((SECONDS < deadline)); do sleep 0.1; done
    kill -0 "$pid" 2>/dev/null && kill -9 -- "-$pid" 2>/dev/null
    log "$1 stopped"
  fi
  rm -f "$pidfile"
}

maildev_url() { printf 'http://127.0.0.1:%s/api/healthz' "$MAIL_WEB_PORT"; }
payment_url() { printf 'http://127.0.0.1:%s/health' "$PAYMENT_FAKE_PORT"; }

start_maildev() {
  start_node_service maildev "$(maildev_url)" node "$ROOT/node_modules/maildev/dist/bin/maildev.js" \
    --smtp "$SMTP_PORT" --ip 127.0.0.1 --web "$MAIL_WEB_PORT" --web-ip 127.0.0.1 --silent
}

start_payment_fake() {
  if [[ -f "$ROOT/docker/payment-fake/server.ts" ]]; then
    start_node_service payment-fake "$(payment_url)" node --import tsx "$ROOT/docker/payment-fake/server.ts"
  fi
}

status() {
  local s
  maria_ping && s=up || s=down; echo "mariadb       $s  127.0.0.1:$MARIADB_PORT"
  redis_ping && s=up || s=down; echo "redis         $s  127.0.0.1:$REDIS_PORT"
  http_ok "$(maildev_url)" && s=up || s=down; echo "maildev       $s  smtp 127.0.0.1:$SMTP_PORT, web http://127.0.0.1:$MAIL_WEB_PORT"
  http_ok "$(payment_url)" && s=up || s=down; echo "payment-fake  $s  http://127.0.0.1:$PAYMENT_FAKE_PORT"
}

main() {
  local cmd="${1:-start}"
  shift || true
  case "$cmd" in
    install) install_packages "$@" ;;
    start)
      install_packages "$@"
      ensure_env_file
      load_env
      mkdir -p "$DATA_DIR"
      start_mariadb
      start_redis
      start_maildev
      start_payment_fake
      ;;
    stop)
      load_env
      stop_node_service payment-fake
      stop_node_service maildev
      stop_redis
      stop_mariadb
      ;;
    status) load_env; write_my_cnf; status ;;
    reset-db) load_env; reset_database "${1:?usage: scripts/services.sh reset-db DATABASE}" ;;
    *) die "usage: scripts/services.sh start [--browser] | stop | status | install [--browser] | reset-db DB" ;;
  esac
}

main "$@"
