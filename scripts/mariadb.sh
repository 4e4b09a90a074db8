#!/usr/bin/env bash
# The project's private MariaDB server: install, initialise, start, stop.
#
#   scripts/mariadb.sh install          apt-get install mariadb-server when mariadbd is missing
#   scripts/mariadb.sh start            initialise the data dir if needed, start on 127.0.0.1, wait, create db + user
#   scripts/mariadb.sh create-db NAME   create one more database the app user may use (server must be running)
#   scripts/mariadb.sh status           exit 0 when the server of this data dir answers
#   scripts/mariadb.sh stop             shut the server down and wait until it is gone
#   scripts/mariadb.sh setup            install + start + stop: leaves a ready data dir behind
#
# Settings (environment): DB_PORT (3307), DB_DATA_DIR (.data/mariadb), DB_NAME (splicepoint),
# DB_USER (splicepoint), DB_PASSWORD (splicepoint-local). The server listens on 127.0.0.1 only;
# the admin account is root over the unix socket, authenticated as the OS user that created the data dir.
set -euo pipefail

ROOT=$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)
DB_PORT=${DB_PORT:-3307}
DB_DATA_DIR=${DB_DATA_DIR:-$ROOT/.data/mariadb}
DB_NAME=${DB_NAME:-splicepoint}
DB_USER=${DB_USER:-splicepoint}
DB_PASSWORD=${DB_PASSWORD:-splicepoint-local}
PATH=$PATH:/usr/sbin:/sbin

LOG_FILE=$DB_DATA_DIR/server.log
PID_FILE=$DB_DATA_DIR/mariadbd.pid
SOCKET=$DB_DATA_DIR/mariadbd.sock
# A unix socket path must stay under ~100 characters; deep checkouts get a short one in /tmp.
if [ ${#SOCKET} -gt 90 ]; then
	SOCKET=/tmp/splicepoint-$(printf '%s' "$DB_DATA_DIR" | md5sum | cut -c1-12).sock
fi

say() { printf '[mariadb] %s\n' "$*" >&2; }

as_root() {
	if [ "$(id -u)" -eq 0 ]; then "$@"
	elif command -v sudo >/dev/null 2>&1; then sudo "$@"
	else say "need root to run: $*"; exit 1; fi
}

cmd_install() {
	if command -v mariadbd >/dev/null 2>&1 && command -v mariadb-install-db >/dev/null 2>&1; then
		return 0
	fi
	say "mariadbd not found: installing Debian's mariadb-server with apt-get"
	as_root env DEBIAN_FRONTEND=noninteractive apt-get update
	as_root env DEBIAN_FRONTEND=noninteractive apt-get install -y --no-install-recommends mariadb-server </dev/null
}

client() { mariadb --no-defaults --socket="$SOCKET" --user=root "$@"; }

answers() { mariadb-admin --no-defaults --socket="$SOCKET" --user=root --connect-timeout=2 ping >/dev/null 2>&1; }

running_pid() {
	[ -f "$PID_FILE" ] || return 1
	local pid
	pid=$(cat "$PID_FILE" 2>/dev/null) || return 1
	[ -n "$pid" ] && kill -0 "$pid" 2>/dev/null && printf '%s' "$pid"
}

cmd_init() {
	[ -d "$DB_DATA_DIR/mysql" ] && return 0
	mkdir -p "$DB_DATA_DIR"
	say "initialising data dir $DB_DATA_DIR"
	if ! mariadb-install-db --no-defaults --user=root --datadir="$DB_DATA_DIR" \
		--auth-root-authentication-method=socket --auth-root-socket-user="$(id -un)" \
		--skip-test-db >"$DB_DATA_DIR/install.log" 2>&1; then
		say "mariadb-install-db failed; its output:"
		cat "$DB_DATA_DIR/install.log" >&2
		exit 1
	fi
}

sql_quote() { printf "%s" "$1" | sed "s/'/''/g"; }

create_db() {
	local name=$1
	case "$name" in *[!A-Za-z0-9_]*|'') say "database name '$name' may hold only letters, digits and _"; exit 1;; esac
	client -e "CREATE DATABASE IF NOT EXISTS \`$name\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;
		CREATE USER IF NOT EXISTS '$(sql_quote "$DB_USER")'@'127.0.0.1' IDENTIFIED BY '$(sql_quote "$DB_PASSWORD")';
		GRANT ALL PRIVILEGES ON \`$name\`.* TO '$(sql_quote "$DB_USER")'@'127.0.0.1';"
}

cmd_start() {
	cmd_install
	cmd_init
	if answers; then
		say "already running on 127.0.0.1:$DB_PORT (data dir $DB_DATA_DIR)"
		create_db "$DB_NAME"
		return 0
	fi
	# A server that was just stopped can hold the port for a moment.
	for _ in $(seq 1 20); do
		if (exec 3<>"/dev/tcp/127.0.0.1/$DB_PORT") 2>/dev/null; then sleep 0.5; else break; fi
	done
	if (exec 3<>"/dev/tcp/127.0.0.1/$DB_PORT") 2>/dev/null; then
		say "port $DB_PORT on 127.0.0.1 is taken by another program; set DB_PORT to a free port"
		exit 1
	fi
	rm -f "$SOCKET"
	# setsid: its own session, so a Ctrl-C in the terminal reaches our cleanup, which shuts it down cleanly.
	setsid mariadbd --no-defaults --user=root --datadir="$DB_DATA_DIR" --socket="$SOCKET" \
		--port="$DB_PORT" --bind-address=127.0.0.1 --pid-file="$PID_FILE" --log-error="$LOG_FILE" \
		--skip-name-resolve --innodb-buffer-pool-size=64M --innodb-log-file-size=16M \
		--character-set-server=utf8mb4 --collation-server=utf8mb4_unicode_ci \
		</dev/null >/dev/null 2>&1 &
	local launched=$!
	for _ in $(seq 1 120); do
		if answers; then
			create_db "$DB_NAME"
			say "running on 127.0.0.1:$DB_PORT (data dir $DB_DATA_DIR)"
			return 0
		fi
		if ! kill -0 "$launched" 2>/dev/null; then break; fi
		sleep 0.5
	done
	say "mariadbd did not come up; last lines of $LOG_FILE:"
	tail -n 30 "$LOG_FILE" >&2 || true
	exit 1
}

cmd_stop() {
	local pid
	if ! pid=$(running_pid); then
		say "not running (data dir $DB_DATA_DIR)"
		return 0
	fi
	mariadb-admin --no-defaults --socket="$SOCKET" --user=root shutdown >/dev/null 2>&1 || kill -TERM "$pid" 2>/dev/null || true
	for _ in $(seq 1 120); do
		kill -0 "$pid" 2>/dev/null || { say "stopped"; return 0; }
		sleep 0.25
	done
	say "mariadbd (pid $pid) did not stop within 30 s; sending SIGKILL"
	kill -KILL "$pid" 2>/dev/null || true
}

case "${1:-}" in
	install) cmd_install ;;
	start) cmd_start ;;
	stop) cmd_stop ;;
	status) answers ;;
	create-db) [ -n "${2:-}" ] || { say "usage: $0 create-db NAME"; exit 2; }; answers || { say "not running"; exit 1; }; create_db "$2" ;;
	setup) cmd_start; cmd_stop ;;
	*) say "usage: $0 install|start|stop|status|create-db NAME|setup"; exit 2 ;;
esac
