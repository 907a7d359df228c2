#!/usr/bin/env bash
# The arith benchmark: the in-process cost of one arith@2 call against arith@1 (the baseline,
# measured in the same run on the same expressions), then arith@2 on phrasings and hostile inputs.
# Usage: load-tests/arith/run.sh    (from any folder; needs Java 17+ and Maven)
set -euo pipefail
here="$(cd "$(dirname "$0")" && pwd)"
root="$(cd "$here/../.." && pwd)"
(cd "$root" && mvn -B -q -DskipTests package)
jar="$root/service/target/reckoner.jar"
echo "# $(date -u +%Y-%m-%dT%H:%M:%SZ) $(nproc) cores, $(java -version 2>&1 | head -1), load average:$(uptime | sed 's/.*load average://')"
java -Xms256m -Xmx256m -Dorg.slf4j.simpleLogger.defaultLogLevel=warn -cp "$jar" "$here/ArithBenchmark.java"
echo "# load average after the run:$(uptime | sed 's/.*load average://')"
