#!/usr/bin/env bash
# The in-process benchmarks (JMH), compiled with the tests from service/src/test/java/reckoner/bench:
#   CallBenchmark    one call through the invoker (schema check, canonical form, tool), per tool version and form
#   LedgerCommitBenchmark  the embedded ledger: fdatasync floor, one commit, one commit through the writer, records per CPU-second
# Usage: load-tests/jmh/run.sh [JMH options, e.g. CallBenchmark -p tool=arith@2]   (from any folder; Java 17+, Maven)
# Writes service/target/jmh-last-run.json (JMH's JSON, with every sample histogram) beside the printed table.
set -euo pipefail
here="$(cd "$(dirname "$0")" && pwd)"
root="$(cd "$here/../.." && pwd)"
cd "$root"
mvn -B -q -DskipTests test-compile dependency:build-classpath -Dmdep.includeScope=test \
  -Dmdep.outputFile="$root/service/target/bench.classpath" -pl service -am >/dev/null
cp="$root/service/target/test-classes:$root/service/target/classes:$(cat "$root/service/target/bench.classpath")"
echo "# $(date -u +%Y-%m-%dT%H:%M:%SZ) $(nproc) cores, $(java -version 2>&1 | head -1), load average:$(uptime | sed 's/.*load average://')"
java -cp "$cp" org.openjdk.jmh.Main -rf json -rff "$root/service/target/jmh-last-run.json" "$@"
echo "# load average after the run:$(uptime | sed 's/.*load average://')"
