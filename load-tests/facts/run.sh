#!/usr/bin/env bash
# The facts@1 load benchmark: builds the service jar, writes a fact file of FACTS facts (default
# 1,000,000) into a temporary folder, loads it and reports load time, heap after GC and lookup
# latency percentiles against a plain HashMap baseline measured in the same run.
# Usage: load-tests/facts/run.sh [FACTS]    (from any folder; needs Java 17+ and Maven)
set -euo pipefail
here="$(cd "$(dirname "$0")" && pwd)"
root="$(cd "$here/../.." && pwd)"
facts="${1:-1000000}"
heap="${BENCH_HEAP:-3g}"

(cd "$root" && mvn -B -q -DskipTests package)
jar="$root/service/target/reckoner.jar"
work="$(mktemp -d)"
trap 'rm -rf "$work"' EXIT

echo "machine: $(nproc) cores, load average before the run:$(uptime | sed 's/.*load average://')"
java -Xmx"$heap" -cp "$jar" "$here/FactsBenchmark.java" generate "$work/facts/bench.jsonl" "$facts"
# A fixed heap (-Xms = -Xmx), as a service is run; G1, the JVM's default collector on this machine size.
java -Xms"$heap" -Xmx"$heap" -XX:+UseG1GC -Dorg.slf4j.simpleLogger.defaultLogLevel=warn \
  -cp "$jar" "$here/FactsBenchmark.java" measure "$work/facts" "$facts"
echo "load average after the run:$(uptime | sed 's/.*load average://')"
