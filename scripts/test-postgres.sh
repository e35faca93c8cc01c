#!/usr/bin/env bash
# A throwaway PostgreSQL server for the storage tests (Debian's package).
#   scripts/test-postgres.sh start DIR   starts one in DIR (created), prints its URL
#   scripts/test-postgres.sh stop DIR    stops it and deletes DIR
# It listens on 127.0.0.1 only, on a free port, with trust authentication:
# for tests, never for data anyone keeps. Runs the server as the `postgres`
# user when started as root (PostgreSQL refuses to run as root). Installs
# Debian's postgresql when it is missing and we are root.
set -euo pipefail

cmd=${1:-}
dir=${2:-}
if [[ -z "$cmd" || -z "$dir" ]]; then
  echo "usage: $0 start|stop DIR" >&2
  exit 2
fi

bindir=$(ls -d /usr/lib/postgresql/*/bin 2>/dev/null | sort -V | tail -1 || true)
if [[ -z "$bindir" && "$cmd" == start ]]; then
  if [[ $(id -u) -ne 0 ]]; then
    echo "test-postgres: PostgreSQL is not installed (apt-get install postgresql)" >&2
    exit 1
  fi
  echo "test-postgres: installing Debian's postgresql" >&2
  export DEBIAN_FRONTEND=noninteractive
  apt-get update -qq
  apt-get install -y -qq postgresql >/dev/null
  bindir=$(ls -d /usr/lib/postgresql/*/bin | sort -V | tail -1)
fi

as_owner() {
  if [[ $(id -u) -eq 0 ]]; then runuser -u postgres -- "$@"; else "$@"; fi
}

case "$cmd" in
  start)
    mkdir -p "$dir"
    chmod 700 "$dir"
    if [[ $(id -u) -eq 0 ]]; then
      chown postgres: "$dir"
      if ! runuser -u postgres -- test -x "$dir"; then
        echo "test-postgres: the postgres user cannot reach $dir (a parent folder is private); choose a folder under /tmp" >&2
        exit 1
      fi
    fi
    as_owner "$bindir/initdb" -D "$dir/data" -U fieldgap --auth=trust -E UTF8 --locale=C.UTF-8 >"$dir/initdb.log" 2>&1 \
      || { cat "$dir/initdb.log" >&2; exit 1; }
    port=$(node -e "const s=require('net').createServer().listen(0,'127.0.0.1',()=>{console.log(s.address().port);s.close()})")
    as_owner "$bindir/pg_ctl" -D "$dir/data" -l "$dir/server.log" -w -t 60 \
      -o "-h 127.0.0.1 -p $port -k $dir -c fsync=on" start >/dev/null \
      || { cat "$dir/server.log" >&2; exit 1; }
    as_owner "$bindir/createdb" -h 127.0.0.1 -p "$port" -U fieldgap fieldgap_test
    echo "postgres://fieldgap@127.0.0.1:$port/fieldgap_test"
    ;;
  stop)
    if [[ -d "$dir/data" ]]; then
      as_owner "$bindir/pg_ctl" -D "$dir/data" -m fast -w stop >/dev/null 2>&1 || true
    fi
    rm -rf "$dir"
    ;;
  *)
    echo "usage: $0 start|stop DIR" >&2
    exit 2
    ;;
esac
