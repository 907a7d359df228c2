#!/usr/bin/env bash
# Sends a JSON Lines file of calls to POST /v1/batch and makes sure every line is answered exactly
# once, however often the connection is cut or the server restarts: the file travels with an
# Idempotency-Key (name it after the dataset), and is sent whole again, with the same key, until the
# answer ends with a complete trailer. Lines the ledger already holds are answered from it
# ("replayed":true) and are not run or recorded again; the rest run, in order.
#
# Usage: ops/send-batch.sh CALLS.ndjson ANSWERS.ndjson KEY [BASE_URL]
#   RECKONER_TOKEN    the API key's secret, if the server has keys
#   RECKONER_ATTEMPTS how many times to send before giving up (default 20)
# ANSWERS.ndjson gets one result a line, in the order of the calls, without the trailer.
set -euo pipefail
calls=${1:?calls file}; answers=${2:?answers file}; key=${3:?idempotency key}; url=${4:-http://127.0.0.1:8080}
attempts=${RECKONER_ATTEMPTS:-20}
auth=()
if [ -n "${RECKONER_TOKEN:-}" ]; then auth=(-H "Authorization: Bearer $RECKONER_TOKEN"); fi
for attempt in $(seq 1 "$attempts"); do
  got=$(mktemp)
  # -N: no buffering, so answers arrive while the file is still being sent (the server answers as it reads).
  curl -sS -N "${auth[@]}" -H 'Content-Type: application/x-ndjson' -H "Idempotency-Key: $key" \
    --data-binary @"$calls" -o "$got" "$url/v1/batch" || true
  last=$(tail -n 1 "$got")
  case "$last" in
    '{"end":true,"complete":true,'*)
      head -n -1 "$got" > "$answers"
      rm -f "$got"
      echo "send-batch: complete after $attempt attempt(s): $last" >&2
      exit 0 ;;
  esac
  # A trailer with "complete":false (shutdown, ledger outage), no trailer (cut), or a 409 (the last
  # attempt still running): wait, then send the whole file again with the same key.
  echo "send-batch: attempt $attempt ended early: ${last:0:160}" >&2
  rm -f "$got"
  sleep $((attempt < 5 ? attempt : 5))
done
echo "send-batch: gave up after $attempts attempts" >&2
exit 1
