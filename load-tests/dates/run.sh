#!/usr/bin/env bash
# The dates call benchmark: builds the service jar and measures one in-process canonicalize + invoke
# for dates@2's phrasings, against dates@1's text form measured in the same run.
# Usage: load-tests/dates/run.sh    (from any folder; needs Java 17+ and Maven)
set -euo pipefail
here="$(cd "$(dirname "$0")" && pwd)"
root="$(cd "$here/../.." && pwd)"
(cd "$root" && mvn -B -q -DskipTests package)
echo "machine: $(nproc) cores, load average before the run:$(uptime | sed 's/.*load average://')"
java -Xms1g -Xmx1g -Dorg.slf4j.simpleLogger.defaultLogLevel=warn -cp "$root/service/target/reckoner.jar" "$here/DatesBenchmark.java"
echo "load average after the run:$(uptime | sed 's/.*load average://')"
