#!/usr/bin/env bash
# Writes a class-data archive (JDK application class-data sharing, -XX:ArchiveClassesAtExit) for
# the service jar: the classes a start and a few calls load, already parsed and verified, so that a
# JVM started with -XX:SharedArchiveFile=ARCHIVE maps them instead of loading them again. On 2 cores
# this took the time to ready from about 4.7 s to about 3.0 s (load-tests/RESULTS.md). The archive
# belongs to the exact JDK build that wrote it; another JDK ignores it with a warning and starts
# as without it. The Dockerfile runs this at image build time.
# Usage: [CLASS_ARCHIVE_PORT=18099] ops/class-archive.sh JAR ARCHIVE   (needs java and curl; 127.0.0.1 only)
set -euo pipefail
jar=${1:?jar}; archive=${2:?archive}
port=${CLASS_ARCHIVE_PORT:-18099}
data=$(mktemp -d)
trap 'rm -rf "$data"' EXIT
java -XX:ArchiveClassesAtExit="$archive" -jar "$jar" serve --port "$port" --data-dir "$data" >"$data/log" 2>&1 &
pid=$!
for _ in $(seq 1 300); do
  curl -fs "http://127.0.0.1:$port/health/ready" >/dev/null && break
  kill -0 "$pid" 2>/dev/null || { cat "$data/log" >&2; exit 1; }
  sleep 0.1
done
base="http://127.0.0.1:$port/v1/tools"
call() { curl -fs -o /dev/null -H 'Content-Type: application/json' -d "$2" "$base/$1/invoke"; }
call arith/1 '{"expr":"1250/4000"}'
call arith/2 '{"text":"15% of 80"}'
call dates/2 '{"text":"in 3 days","as_of":"2031-05-17"}'
call units/2 '{"text":"3 km to mi"}'
call facts/1 '{"text":"capital","as_of":"2031-05-17"}'
call search/1 '{"text":"harbour"}' || true
curl -fs -o /dev/null -H 'Content-Type: application/x-ndjson' --data-binary $'{"id":1,"tool":"arith","args":{"expr":"2+2"}}\n' \
  "http://127.0.0.1:$port/v1/batch"
kill -TERM "$pid"
wait "$pid" || true # 143 after SIGTERM; the archive is written as the JVM exits
test -s "$archive" || { echo "class-archive.sh: no archive was written" >&2; cat "$data/log" >&2; exit 1; }
