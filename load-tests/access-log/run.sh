#!/usr/bin/env bash
# What the access log and the request tracker cost one invoke: two servers in the same run, one
# with the access log (the default) and one with --no-access-log, measured in turn with the same
# wrk load, twice each (A B A B), so that the machine's swings hit both alike.
#
# Usage: load-tests/access-log/run.sh [warmup-seconds] [measure-seconds]
# Needs: wrk (Debian package "wrk"), a built jar (mvn -B -q -DskipTests package).
# Talks only to 127.0.0.1. The servers log to files in a temp dir (as a collector would read them).
set -euo pipefail
cd "$(dirname "$0")/../.."
warmup=${1:-30}
measure=${2:-15}
jar=service/target/reckoner.jar
[ -f "$jar" ] || { echo "build first: mvn -B -q -DskipTests package" >&2; exit 2; }
command -v wrk >/dev/null || { echo "install wrk: apt-get install -y wrk" >&2; exit 2; }

data=$(mktemp -d)
start() { # port, extra args
  java -Xms256m -Xmx512m -jar "$jar" serve --port "$1" --data-dir "$data/$1" --durability async ${2:-} >"$data/$1.log" 2>&1 &
  echo $!
}
on=$(start 18091)
off=$(start 18092 --no-access-log)
trap 'kill $on $off 2>/dev/null; wait $on $off 2>/dev/null; rm -rf "$data"' EXIT
for port in 18091 18092; do
  for _ in $(seq 1 100); do curl -fs "http://127.0.0.1:$port/health/ready" >/dev/null && break; sleep 0.2; done
done

echo "# $(date -u +%Y-%m-%dT%H:%M:%SZ) $(nproc) cores, $(java -version 2>&1 | head -1), durability async"
echo "# warm-up: ${warmup}s of invoke load on each, 8 connections"
for port in 18091 18092; do
  wrk -t2 -c8 -d"${warmup}s" -s load-tests/invoke/arith.lua "http://127.0.0.1:$port/v1/tools/arith/1/invoke" >/dev/null
done

run() { # name, port, connections
  local out p50 p99 rps
  out=$(wrk -t1 -c"$3" -d"${measure}s" --latency -s load-tests/invoke/arith.lua "http://127.0.0.1:$2/v1/tools/arith/1/invoke")
  p50=$(echo "$out" | awk '/^ +50%/ {print $2}')
  p99=$(echo "$out" | awk '/^ +99%/ {print $2}')
  rps=$(echo "$out" | awk '/^Requests\/sec/ {print $2}')
  printf '%-18s connections=%-3s p50=%-9s p99=%-9s requests/s=%s\n' "$1" "$3" "$p50" "$p99" "$rps"
}
for conns in 1 16; do
  echo "# $conns connection(s)"
  for round in 1 2; do
    run "access log on" 18091 "$conns"
    run "access log off" 18092 "$conns"
  done
done
echo "# access lines written by the server with the access log: $(grep -c '"logger_name":"reckoner.access"' "$data/18091.log")"
