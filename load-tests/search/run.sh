#!/usr/bin/env bash
# The search@1 benchmark: builds the service jar, generates a collection of PASSAGES passages (default
# 1,000,000) into a temporary folder, then (1) in-process: first load with the on-disk index build,
# a restart that reuses the index, query latency against arith@1 in the same run; (2) over HTTP: the
# service started on the same files and index with the same maximum heap (BENCH_HEAP, default 160m), the same queries and arith@1 as the
# baseline, and the server's resident memory. Everything it writes is deleted at the end.
# Usage: load-tests/search/run.sh [PASSAGES] [QUERIES]    (from any folder; needs Java 17+ and Maven)
set -euo pipefail
here="$(cd "$(dirname "$0")" && pwd)"
root="$(cd "$here/../.." && pwd)"
passages="${1:-1000000}"
queries="${2:-20000}"
heap="${BENCH_HEAP:-160m}"
port="${BENCH_PORT:-18480}"

(cd "$root" && mvn -B -q -DskipTests package)
jar="$root/service/target/reckoner.jar"
work="$(mktemp -d)"
server=""
cleanup() { if [ -n "$server" ]; then kill "$server" 2>/dev/null || true; wait "$server" 2>/dev/null || true; fi; rm -rf "$work"; }
trap cleanup EXIT
mkdir -p "$work/collections" "$work/data"

echo "machine: $(nproc) cores, load average before the run:$(uptime | sed 's/.*load average://')"
java -cp "$jar" "$here/SearchBenchmark.java" generate "$work/collections/bench.jsonl" "$passages"
java -Xmx"$heap" -XX:+UseG1GC -Dorg.slf4j.simpleLogger.defaultLogLevel=warn \
  -cp "$jar" "$here/SearchBenchmark.java" inproc "$work/collections" "$work/data/search-index" "$queries"

java -Xmx"$heap" -XX:+UseG1GC -Dorg.slf4j.simpleLogger.defaultLogLevel=warn -jar "$jar" serve \
  --port "$port" --data-dir "$work/data" --search-dir "$work/collections" --search-default-collection bench \
  --cache-size 0 > "$work/server.log" 2>&1 &
server=$!
start=$(date +%s.%N)
for _ in $(seq 1 600); do
  if curl -sf "http://127.0.0.1:$port/health/ready" > /dev/null; then break; fi
  sleep 0.5
done
memory() { grep -E 'VmHWM|VmRSS|RssAnon|RssFile' "/proc/$1/status" | tr -s ' \t\n' ' '; }
echo "server ready (index reused from the in-process run) after $(echo "$(date +%s.%N) - $start" | bc) s; $(memory "$server")"
java -cp "$jar" "$here/SearchBenchmark.java" http "http://127.0.0.1:$port" "$queries" 2
echo "server after the HTTP run: $(memory "$server")"
curl -s "http://127.0.0.1:$port/v1/admin/search"; echo
echo "load average after the run:$(uptime | sed 's/.*load average://')"
