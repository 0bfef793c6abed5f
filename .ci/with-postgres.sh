#!/usr/bin/env bash
# Run a command with a throw-away PostgreSQL cluster: initdb in a temporary folder owned by the
# `postgres` user, a free port on 127.0.0.1, one database, HOOPWISE_TEST_PG_URL exported for the
# command, and the cluster stopped and removed when the command ends (also on failure or Ctrl-C).
# Installs Debian's postgresql package when no server binaries are found.
#
#   .ci/with-postgres.sh npm test
#   .ci/with-postgres.sh npx vitest run --config test/vitest.config.ts test/store
set -euo pipefail

as_root() { if [ "$(id -u)" = 0 ]; then "$@"; else sudo "$@"; fi; }

pg_bin() { ls -d /usr/lib/postgresql/*/bin 2>/dev/null | sort -V | tail -n 1; }

if [ -z "$(pg_bin)" ] || [ ! -x "$(pg_bin)/initdb" ]; then
  export DEBIAN_FRONTEND=noninteractive
  as_root apt-get update -qq
  as_root apt-get install -y -qq --no-install-recommends postgresql >/dev/null
fi
BIN="$(pg_bin)"

# PostgreSQL refuses to run as root: as root the cluster runs as `postgres`, otherwise as whoever
# runs this script.
if [ "$(id -u)" = 0 ]; then
  as_pg() { runuser -u postgres -- "$@"; }
else
  as_pg() { "$@"; }
fi

DIR="$(mktemp -d /tmp/hoopwise-pg.XXXXXX)"
chmod 755 "$DIR"
[ "$(id -u)" = 0 ] && chown postgres: "$DIR"
PORT="$(node -e 'const s=require("net").createServer();s.listen(0,"127.0.0.1",()=>{console.log(s.address().port);s.close()})')"

cleanup() {
  as_pg "$BIN/pg_ctl" -D "$DIR/data" -m immediate stop >/dev/null 2>&1 || true
  rm -rf "$DIR"
}
trap cleanup EXIT INT TERM

as_pg "$BIN/initdb" -D "$DIR/data" -U hoopwise --auth=trust -E UTF8 --locale=C.UTF-8 >"$DIR/initdb.log" 2>&1 ||
  { cat "$DIR/initdb.log" >&2; exit 1; }
# Local socket in the folder (not /var/run/postgresql, which may not exist); TCP on 127.0.0.1 only.
as_pg "$BIN/pg_ctl" -D "$DIR/data" -l "$DIR/server.log" -w -t 60 \
  -o "-p $PORT -k $DIR -c listen_addresses=127.0.0.1 -c fsync=off -c max_connections=200" start >/dev/null ||
  { cat "$DIR/server.log" >&2; exit 1; }
as_pg "$BIN/createdb" -h 127.0.0.1 -p "$PORT" -U hoopwise hoopwise_test

export HOOPWISE_TEST_PG_URL="postgres://hoopwise@127.0.0.1:$PORT/hoopwise_test"
echo "PostgreSQL $("$BIN/postgres" --version | awk '{print $3}') on port $PORT for the tests (HOOPWISE_TEST_PG_URL)" >&2
"$@"
