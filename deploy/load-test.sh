#!/usr/bin/env bash
# Load test on loopback only: requests per second for POST /v1/evaluations (the demo corner) against the
# near-empty GET /healthz, in one run of one service process. Needs wrk (Debian package wrk).
# Usage: deploy/load-test.sh [seconds per run, default 10] [connections, default 8]
set -euo pipefail
cd "$(dirname "$0")/.."
seconds=${1:-10}
connections=${2:-8}
port=5199
url="http://127.0.0.1:$port"

command -v wrk >/dev/null || { echo "wrk is missing: apt-get install -y wrk" >&2; exit 1; }
dotnet build -c Release src/SafetyMirror.Api -v q -nologo >/dev/null
# A generous rate limit: the limiter would otherwise answer most of the load with 429.
Limits__PermitLimit=100000000 URLS="$url" dotnet run -c Release --no-build --project src/SafetyMirror.Api >/tmp/safetymirror-load.log 2>&1 &
service=$!
trap 'kill $service 2>/dev/null || true' EXIT
for _ in $(seq 60); do curl -fs "$url/healthz" >/dev/null 2>&1 && break; sleep 0.5; done

lua=$(mktemp --suffix=.lua)
cat >"$lua" <<LUA
wrk.method = "POST"
wrk.headers["Content-Type"] = "application/json"
local f = io.open("openapi/examples/demo-corner-local.json", "rb"); wrk.body = f:read("*a"); f:close()
LUA

rps() { sed -n 's/^Requests\/sec: *\([0-9.]*\).*/\1/p'; }
status=$(curl -s -o /dev/null -w '%{http_code}' -X POST -H 'Content-Type: application/json' --data-binary @openapi/examples/demo-corner-local.json "$url/v1/evaluations")
[ "$status" = 200 ] || { echo "the demo evaluation answered $status" >&2; exit 1; }

wrk -t2 -c"$connections" -d2s "$url/healthz" >/dev/null   # warm-up
wrk -t2 -c"$connections" -d2s -s "$lua" "$url/v1/evaluations" >/dev/null
empty=$(wrk -t2 -c"$connections" -d"${seconds}s" "$url/healthz" | rps)
evaluation=$(wrk -t2 -c"$connections" -d"${seconds}s" -s "$lua" "$url/v1/evaluations" | rps)
echo "GET /healthz:          $empty requests/s"
echo "POST /v1/evaluations:  $evaluation requests/s"
awk -v e="$evaluation" -v h="$empty" 'BEGIN { printf "ratio evaluation/empty: %.4f\n", e / h }'
