#!/usr/bin/env bash
# Measures the SQLite ledger on this machine: write throughput (baselines, then the group-commit
# writer after a warm-up) and, with "query", filter latencies over a large ledger.
#
#   bash load-tests/ledger/run.sh                 # write: 45 s warm-up, 30 s measured
#   bash load-tests/ledger/run.sh write 45 30
#   bash load-tests/ledger/run.sh query 10000000  # fills 10 million records, then times each filter
#   bash load-tests/ledger/run.sh query-postgres 10000000 'jdbc:postgresql://127.0.0.1:55432/scratch?user=postgres'
#                                                 # the same on PostgreSQL; the database's ledger table is emptied first
#
# Everything runs in one JVM against a ledger in a temp dir that is removed afterwards. The load
# average is printed too: the machine may be shared, and the figures depend on it.
set -euo pipefail
cd "$(dirname "$0")/../.."
mvn -B -q -o test-compile -pl service
mvn -B -q -o dependency:build-classpath -pl service -Dmdep.outputFile=target/bench-classpath.txt -Dmdep.includeScope=test
# A copy of the classes, so that a build during the run cannot pull them away.
COPY="$(mktemp -d)"
trap 'rm -rf "$COPY"' EXIT
cp -r service/target/classes "$COPY/classes"
cp -r service/target/test-classes "$COPY/test-classes"
CP="$COPY/test-classes:$COPY/classes:$(cat service/target/bench-classpath.txt)"
echo "command: bash load-tests/ledger/run.sh ${*:-write}"
echo "load average at start: $(cut -d' ' -f1-3 /proc/loadavg)"
java -Xmx2g -cp "$CP" reckoner.ledger.LedgerBenchmark "${@:-write}"
echo "load average at end: $(cut -d' ' -f1-3 /proc/loadavg)"
