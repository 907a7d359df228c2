#!/usr/bin/env bash
# Latency and throughput of one arith@1 invoke over HTTP, against a baseline in the same run:
# GET /health/live, which crosses the same HTTP stack but runs no tool.
#
# Usage: [SERVER_ARGS="--durability async"] load-tests/invoke/run.sh [warmup-seconds] [measure-seconds]
# Needs: wrk (Debian package "wrk"), a built jar (mvn -B -q -DskipTests package).
# Talks only to 127.0.0.1.
set -euo pipefail
cd "$(dirname "$0")/../.."
warmup=${1:-45}
measure=${2:-20}
port=${PORT:-18088}
jar=service/target/reckoner.jar
[ -f "$jar" ] || { echo "build first: mvn -B -q -DskipTests package" >&2; exit 2; }
command -v wrk >/dev/null || { echo "install wrk: apt-get install -y wrk" >&2; exit 2; }

data=$(mktemp -d)
java -Xms256m -Xmx512m -jar "$jar" serve --port "$port" --data-dir "$data" ${SERVER_ARGS:-} >"$data/server.log" 2>&1 &
pid=$!
trap 'kill $pid 2>/dev/null; wait $pid 2>/dev/null; rm -rf "$data"' EXIT
for _ in $(seq 1 100); do curl -fs "http://127.0.0.1:$port/health/ready" >/dev/null && break; sleep 0.2; done

url="http://127.0.0.1:$port"
echo "# $(date -u +%Y-%m-%dT%H:%M:%SZ) $(nproc) cores, $(java -version 2>&1 | head -1)"
echo "# warm-up: ${warmup}s of invoke load, 8 connections"
wrk -t2 -c8 -d"${warmup}s" -s load-tests/invoke/arith.lua "$url/v1/tools/arith/1/invoke" >/dev/null

run() { # name, connections, script-or-empty, path
  local name=$1 conns=$2 script=$3 path=$4 out
  if [ -n "$script" ]; then
    out=$(wrk -t1 -c"$conns" -d"${measure}s" --latency -s "$script" "$url$path")
  else
    out=$(wrk -t1 -c"$conns" -d"${measure}s" --latency "$url$path")
  fi
  local p50 p99 rps
  p50=$(echo "$out" | awk '/^ +50%/ {print $2}')
  p99=$(echo "$out" | awk '/^ +99%/ {print $2}')
  rps=$(echo "$out" | awk '/^Requests\/sec/ {print $2}')
  printf '%-28s connections=%-3s p50=%-9s p99=%-9s requests/s=%s\n' "$name" "$conns" "$p50" "$p99" "$rps"
}

echo "# one caller at a time (sequential requests on one connection)"
run "baseline GET /health/live" 1 "" /health/live
run "invoke arith@1 1250/4000" 1 load-tests/invoke/arith.lua /v1/tools/arith/1/invoke
echo "# 16 concurrent connections"
run "baseline GET /health/live" 16 "" /health/live
run "invoke arith@1 1250/4000" 16 load-tests/invoke/arith.lua /v1/tools/arith/1/invoke
