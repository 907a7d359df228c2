#!/usr/bin/env bash
# What stands behind an answer in durability `commit`, for each `ledger-sync` setting, measured on
# the SQLite ledger (its intake log, ledger.intake/):
#   1. syncs per call: strace -f -c counts fsync/fdatasync while wrk sends committed calls at one
#      connection (the intake log's sync and the bulk moves' syncs into ledger.db together);
#   2. order: for one call, strace -f -tt shows the fdatasync of the intake log returning before
#      the answer is written to the socket;
#   3. process crash: N calls answered 200, then SIGKILL; the next start must hold all N records.
# Power loss cannot be pulled here; (1) and (2) are what makes the difference: with sync, the
# record is on the disk (fdatasync returned) before the answer leaves; without, it is in the
# page cache only, which a process crash keeps and a power loss may not.
# Usage: load-tests/ledger/durability.sh [N]   (after mvn -B -q -DskipTests package; needs strace, wrk)
set -euo pipefail
cd "$(dirname "$0")/../.."
n=${1:-300}
jar=service/target/reckoner.jar
port() { python3 -c 'import socket;s=socket.socket();s.bind(("127.0.0.1",0));print(s.getsockname()[1])'; }
lua=$(mktemp); cat > "$lua" <<'LUA'
wrk.method = "POST"; wrk.body = '{"expr":"1250/4000"}'
wrk.headers["Content-Type"] = "application/json"; wrk.headers["Accept"] = "text/plain"
LUA
start() { # dir port sync -> pid
  java -jar "$jar" serve --port "$2" --data-dir "$1" --ledger-sync "$3" >>"$1/server.log" 2>&1 &
  local pid=$!
  for _ in $(seq 1 150); do curl -fs "http://127.0.0.1:$2/health/ready" >/dev/null && break; sleep 0.2; done
  echo "$pid"
}
gone() { while kill -0 "$1" 2>/dev/null; do sleep 0.1; done; }
echo "# $(date -u +%FT%TZ) $(nproc) cores, $(java -version 2>&1 | head -1), $(df -T . | awk 'NR==2 {print $2}') file system"
for sync in true false; do
  dir=$(mktemp -d); p=$(port); pid=$(start "$dir" "$p" "$sync")
  url="http://127.0.0.1:$p/v1/tools/arith/1/invoke"
  wrk -t1 -c1 -d10s -s "$lua" "$url" >/dev/null # warm-up
  strace -f -c -e trace=fsync,fdatasync -o "$dir/strace-count" -p "$pid" 2>/dev/null & st=$!
  sleep 1
  out=$(wrk -t1 -c1 -d5s -s "$lua" "$url")
  sleep 0.5; kill -INT $st; wait $st 2>/dev/null || true
  reqs=$(echo "$out" | awk '/requests in/ {print $1}')
  syncs=$(awk '$NF=="fsync" || $NF=="fdatasync" {s += $4} END {print s + 0}' "$dir/strace-count")
  echo "ledger-sync=$sync: $reqs committed calls at one connection, $syncs fsync/fdatasync calls in all ($(python3 -c "print(round($syncs/$reqs, 2))") a call)"
  strace -f -tt -e trace=fdatasync,fsync,write,writev -o "$dir/strace-order" -p "$pid" 2>/dev/null & st=$!
  sleep 1
  curl -s -o /dev/null -H 'Content-Type: application/json' -H 'Accept: text/plain' -d '{"expr":"6*7"}' "$url"
  sleep 0.3; kill -INT $st; wait $st 2>/dev/null || true
  echo "  one call, in order (fdatasync/fsync of a file; write/writev of the answer to the socket):"
  grep -E 'fdatasync|fsync|HTTP/1.1 200' "$dir/strace-order" | grep -v 'resumed>' | cut -c1-110 | sed 's/^/    /' | head -6
  ok=0
  for i in $(seq 1 "$n"); do
    code=$(curl -s -o /dev/null -w '%{http_code}' -H 'Content-Type: application/json' -H "Reckoner-Run: crash-$sync" \
      -d "{\"expr\":\"$i+1\"}" "$url")
    [ "$code" = 200 ] && ok=$((ok + 1))
  done
  kill -9 "$pid"; gone "$pid"
  behind=$(ls "$dir/ledger.intake" 2>/dev/null | grep -c '\.log$' || true)
  p=$(port); pid=$(start "$dir" "$p" "$sync")
  found=$(curl -fs "http://127.0.0.1:$p/v1/invocations?run=crash-$sync&limit=1000" | python3 -c 'import json,sys; print(len(json.load(sys.stdin)["invocations"]))')
  echo "  process crash: $ok calls answered 200, SIGKILL ($behind intake segment(s) left), restart: $found records of the run"
  kill "$pid"; gone "$pid"
  rm -rf "$dir"
done
rm -f "$lua"
