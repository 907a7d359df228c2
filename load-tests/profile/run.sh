#!/usr/bin/env bash
# A CPU profile of the invoke endpoint under wrk load, taken with async-profiler (from Maven Central,
# tools.profiler:async-profiler; it samples Java, native and kernel frames alike, which matters here:
# much of a call's time is system calls). Start the service, warm it up with wrk, attach the
# profiler with jcmd for RECORD seconds of the same load, print the hottest frames (hot.py).
# Usage: [SERVER_ARGS="--durability async"] [JAVA_OPTS=...] [EVENT=cpu|wall] \
#        load-tests/profile/run.sh CONNECTIONS [WARMUP-S] [RECORD-S] [OUT.collapsed]
# Needs: wrk, Maven, a built jar (mvn -B -q -DskipTests package); root, or kernel.perf_event_paranoid <= 1
# for kernel frames. Talks only to 127.0.0.1.
set -euo pipefail
cd "$(dirname "$0")/../.."
conns=${1:?connections}; warm=${2:-45}; rec=${3:-20}; out=${4:-/tmp/reckoner-profile.collapsed}
port=${PORT:-18201}; event=${EVENT:-cpu}
ap=/tmp/async-profiler-4.1
if [ ! -f "$ap/linux-x64/libasyncProfiler.so" ]; then
  mvn -B -q dependency:get -Dartifact=tools.profiler:async-profiler:4.1 >/dev/null
  mkdir -p "$ap" && (cd "$ap" && unzip -o -q ~/.m2/repository/tools/profiler/async-profiler/4.1/async-profiler-4.1.jar)
fi
data=$(mktemp -d)
java ${JAVA_OPTS:-} -jar service/target/reckoner.jar serve --port "$port" --data-dir "$data" ${SERVER_ARGS:-} >"$data/server.log" 2>&1 &
pid=$!
trap 'kill $pid 2>/dev/null; wait $pid 2>/dev/null; rm -rf "$data"' EXIT
for _ in $(seq 1 150); do curl -fs "http://127.0.0.1:$port/health/ready" >/dev/null && break; sleep 0.2; done
lua=$(mktemp); cat > "$lua" <<'LUA'
wrk.method = "POST"; wrk.body = '{"expr":"1250/4000"}'
wrk.headers["Content-Type"] = "application/json"; wrk.headers["Accept"] = "text/plain"
LUA
url="http://127.0.0.1:$port/v1/tools/arith/1/invoke"
wrk -t1 -c"$conns" -d"${warm}s" -s "$lua" "$url" >/dev/null
# jcmd's JVMTI.agent_load splits an option string at '=', so Attach.java passes it whole.
java load-tests/profile/Attach.java "$pid" "$ap/linux-x64/libasyncProfiler.so" "start,event=$event,interval=1ms,threads"
wrk -t1 -c"$conns" -d"${rec}s" --latency -s "$lua" "$url" | grep -E "Requests/sec|^ +(50|99)%"
java load-tests/profile/Attach.java "$pid" "$ap/linux-x64/libasyncProfiler.so" "stop,file=$out,collapsed,threads"
python3 load-tests/profile/hot.py "$out" ${TOP:-30}
