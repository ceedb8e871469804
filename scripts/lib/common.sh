#!/usr/bin/env bash
# Shared by start.sh and test.sh: dependencies, the private PostgreSQL cluster, secrets.
# Every function prints what it does; failures say why and how to fix them.

say() { printf '\033[1m[darnwell]\033[0m %s\n' "$*"; }
die() { printf '\033[1;31m[darnwell] %s\033[0m\n' "$*" >&2; exit 1; }

ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/../.." && pwd)"
cd "$ROOT"

is_root() { [ "$(id -u)" = "0" ]; }

apt_install() {
  # apt_install PKG... (only as root; otherwise print what to install and stop)
  if ! is_root; then
    die "Missing system packages: $*. Install them with: sudo apt-get install -y $*"
  fi
  say "installing $* with apt-get"
  if [ ! -f /var/lib/apt/periodic/darnwell-updated ] || [ -z "$(ls -A /var/lib/apt/lists 2>/dev/null | grep -v lock)" ]; then
    DEBIAN_FRONTEND=noninteractive apt-get update -qq || die "apt-get update failed"
    mkdir -p /var/lib/apt/periodic && touch /var/lib/apt/periodic/darnwell-updated
  fi
  DEBIAN_FRONTEND=noninteractive apt-get install -y -qq "$@" >/dev/null || die "apt-get install $* failed"
}

ensure_node_modules() {
  # Reinstall when node_modules is missing or older than the lock file.
  local stamp=node_modules/.darnwell-lock-hash
  local want
  want="$(sha256sum package-lock.json | cut -d' ' -f1)"
  if [ ! -d node_modules ] || [ ! -f "$stamp" ] || [ "$(cat "$stamp")" != "$want" ]; then
    say "installing npm dependencies (npm ci)"
    run_step npm ci --no-audit --no-fund --loglevel=error || die "npm ci failed"
    echo "$want" > "$stamp"
  fi
}

pg_bindir() {
  local d
  d="$(ls -d /usr/lib/postgresql/*/bin 2>/dev/null | sort -V | tail -n 1)"
  [ -n "$d" ] && [ -x "$d/initdb" ] && { echo "$d"; return 0; }
  return 1
}

ensure_postgres_installed() {
  if ! pg_bindir >/dev/null; then
    apt_install postgresql
    pg_bindir >/dev/null || die "PostgreSQL is still missing after apt-get install postgresql"
  fi
}

# Run a PostgreSQL server binary: as root, as the postgres user (initdb refuses to run as root).
pg_run() {
  local bin
  bin="$(pg_bindir)/$1"; shift
  if is_root; then runuser -u postgres -- "$bin" "$@"; else "$bin" "$@"; fi
}

# pg_up DIR PORT: create the cluster in DIR if needed and start it on 127.0.0.1:PORT.
pg_up() {
  local dir="$1" port="$2"
  ensure_postgres_installed
  mkdir -p "$(dirname "$dir")"
  if [ ! -f "$dir/PG_VERSION" ]; then
    say "creating a private PostgreSQL cluster in $dir"
    mkdir -p "$dir"
    if is_root; then chown postgres:postgres "$dir"; chmod 700 "$dir"; fi
    pg_run initdb -D "$dir" -A trust -U darnwell -E UTF8 --locale=C.UTF-8 >"$dir.initdb.log" 2>&1 \
      || die "initdb failed (see $dir.initdb.log)"
  fi
  if pg_run pg_ctl -D "$dir" status >/dev/null 2>&1; then
    say "PostgreSQL already running in $dir"
  else
    # A stale pid file from a killed server stops pg_ctl; it is safe to remove when no server runs.
    rm -f "$dir/postmaster.pid"
    pg_run pg_ctl -D "$dir" -l "$dir/server.log" -w -t 60 \
      -o "-p $port -k $dir -c listen_addresses=127.0.0.1 -c fsync=off" start >/dev/null \
      || die "PostgreSQL could not start on 127.0.0.1:$port. The log says:
$(tail -n 15 "$dir/server.log" 2>/dev/null)
Is another server using port $port? (ss -ltnp | grep $port) Remove $dir to start from scratch."
  fi
  local i
  for i in $(seq 1 30); do
    psql -h 127.0.0.1 -p "$port" -U darnwell -d postgres -Atqc "select 1" >/dev/null 2>&1 && break
    sleep 0.5
  done
  psql -h 127.0.0.1 -p "$port" -U darnwell -d postgres -Atqc "select 1" >/dev/null 2>&1 \
    || die "PostgreSQL started but does not answer on 127.0.0.1:$port"
}

# pg_create_db PORT NAME
pg_create_db() {
  local port="$1" name="$2"
  if [ "$(psql -h 127.0.0.1 -p "$port" -U darnwell -d postgres -Atqc "select 1 from pg_database where datname='$name'")" != "1" ]; then
    psql -h 127.0.0.1 -p "$port" -U darnwell -d postgres -qc "create database \"$name\"" >/dev/null || die "cannot create database $name"
  fi
}

pg_down() {
  local dir="$1"
  [ -f "$dir/PG_VERSION" ] || return 0
  pg_run pg_ctl -D "$dir" -m fast -w stop >/dev/null 2>&1 || true
}

# Secrets generated once for local use; kept in the git-ignored data folder.
ensure_local_secrets() {
  local file="$1"
  if [ ! -f "$file" ]; then
    mkdir -p "$(dirname "$file")"
    umask 077
    {
      echo "BETTER_AUTH_SECRET=$(node -e 'console.log(require("crypto").randomBytes(32).toString("base64url"))')"
    } > "$file"
  fi
  set -a; . "$file"; set +a
}

# ensure_port_free PORT WHAT: refuse to start a service on a port something else already holds
# (otherwise the scripts would talk to a stale server).
ensure_port_free() {
  local port="$1" what="$2"
  if (exec 3<>"/dev/tcp/127.0.0.1/$port") 2>/dev/null; then
    die "Port $port (for $what) is already in use on 127.0.0.1. Stop what holds it (ss -ltnp | grep :$port) or choose another port."
  fi
}

# wait_http URL SECONDS
wait_http() {
  local url="$1" secs="${2:-60}" i
  for i in $(seq 1 $((secs * 4))); do
    curl -fsS -o /dev/null "$url" 2>/dev/null && return 0
    sleep 0.25
  done
  return 1
}

# Source hash for "is the production build up to date".
source_hash() {
  { git ls-files -co --exclude-standard -- app components lib db templates fonts next.config.mjs \
      tailwind.config.ts postcss.config.mjs tsconfig.json package-lock.json 2>/dev/null | sort | xargs -r sha256sum; \
  } | sha256sum | cut -d' ' -f1
}

# build_app DISTDIR: next build unless the sources are unchanged since the last build there.
build_app() {
  local dist="$1" stamp want log
  stamp="$dist/.darnwell-source-hash"
  log="$ROOT/.data/build${dist#.next}.log"
  want="$(source_hash)"
  if [ -f "$stamp" ] && [ "$(cat "$stamp")" = "$want" ] && [ -f "$dist/BUILD_ID" ]; then
    say "production build in $dist is up to date"
    return 0
  fi
  say "building the app (next build → $dist)"
  run_step env NEXT_DIST_DIR="$dist" NEXT_TELEMETRY_DISABLED=1 npx next build >"$log" 2>&1 \
    || { tail -n 40 "$log"; die "next build failed (full log: ${log#$ROOT/})"; }
  echo "$want" > "$stamp"
}

# All processes below PID (children first found, then theirs), not including PID itself.
descendants() {
  local c
  for c in $(pgrep -P "$1" 2>/dev/null); do
    echo "$c"
    descendants "$c"
  done
}

# run_step CMD…: runs a long step (install, build, test run) in the background and waits for it. Bash
# holds a trapped signal back until a foreground command ends, so a build of several minutes would
# delay Ctrl-C or SIGTERM that long; `wait` is interrupted at once, and the EXIT trap then stops the
# step with stop_descendants.
run_step() {
  "$@" &
  wait $!
}

# stop_descendants: SIGTERM to every process below this script (a step still running, the services).
stop_descendants() {
  local pid
  for pid in $(descendants "$$"); do kill -TERM "$pid" 2>/dev/null || true; done
}

# watch_parent: npm runs a script under `sh -c` and passes no signal on to it, so `kill <npm pid>`
# would leave everything running. A watchdog notices when the script's parent is gone and stops the
# script as if it had been interrupted: every process below it gets SIGTERM (a long foreground step
# such as the build would otherwise hold back the trap), then the script itself, whose EXIT trap
# stops the services and the database.
watch_parent() {
  local parent="$PPID" me="$$"
  (
    while kill -0 "$parent" 2>/dev/null; do sleep 1; done
    say "the parent process ($parent) is gone: stopping"
    for pid in $(descendants "$me"); do
      [ "$pid" = "$BASHPID" ] || kill -TERM "$pid" 2>/dev/null || true
    done
    kill -TERM "$me" 2>/dev/null || true
  ) &
  WATCHDOG_PID=$!
}
