#!/usr/bin/env bash
# The units@1 / units@2 latency benchmark: builds the service jar and times canonicalize + invoke
# of each case on the tools themselves, units@1 on the same phrase as the baseline, in one run.
# Usage: load-tests/units/run.sh    (from any folder; needs Java 17+ and Maven)
set -euo pipefail
here="$(cd "$(dirname "$0")" && pwd)"
root="$(cd "$here/../.." && pwd)"
(cd "$root" && mvn -B -q -DskipTests package)
jar="$root/service/target/reckoner.jar"
echo "machine: $(nproc) cores, load average before the run:$(uptime | sed 's/.*load average://')"
java -Xms512m -Xmx512m -XX:+UseG1GC -Dorg.slf4j.simpleLogger.defaultLogLevel=warn -cp "$jar" "$here/UnitsBenchmark.java"
echo "load average after the run:$(uptime | sed 's/.*load average://')"
