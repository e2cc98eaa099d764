#!/usr/bin/env bash
# Load on loopback only, against one service process at a time (needs Debian's wrk):
#  1. the mix of evaluations, recommendations and reports (deploy/load-mix.lua, 7:2:1) from CONNECTIONS clients for
#     SECONDS against the service as it runs in production (--environment Production, the rate limits of
#     appsettings.json): every answer must be a 2xx or an intended 429;
#  2. the same mix with the rate limit lifted, so every request is computed: p50/p99 under full load;
#  3. POST /v1/evaluations alone over HTTP against the same evaluation in process on the same cores
#     (tests/SafetyMirror.Benchmarks demo-throughput), stage by stage.
# Each phase prints the service's resident memory (RSS) before and after. Exits 1 if any answer was an error.
# Usage: deploy/load-mix.sh [seconds per phase, default 60] [connections, default 64]
# With API keys on, set API_KEY to a key the service accepts.
set -euo pipefail
cd "$(dirname "$0")/.."
seconds=${1:-60}
connections=${2:-64}
port=5198
url="http://127.0.0.1:$port"
log=$(mktemp --suffix=.log)

command -v wrk >/dev/null || { echo "wrk is missing: apt-get install -y wrk" >&2; exit 2; }
dotnet build -c Release src/SafetyMirror.Api -v q -nologo >/dev/null
dotnet build -c Release tests/SafetyMirror.Benchmarks -v q -nologo >/dev/null

service=
stop_service() { if [ -n "$service" ]; then kill "$service" 2>/dev/null || true; wait "$service" 2>/dev/null || true; service=; fi; }
trap stop_service EXIT

# Starts the service in the Production environment with extra settings given as NAME=VALUE words.
start_service() {
  env "$@" dotnet src/SafetyMirror.Api/bin/Release/net10.0/SafetyMirror.Api.dll --environment Production --urls "$url" >>"$log" 2>&1 &
  service=$!
  for _ in $(seq 120); do curl -fs "$url/healthz" >/dev/null 2>&1 && return; sleep 0.5; done
  echo "the service did not start; its log: $log" >&2
  exit 2
}

rss_mb() { awk '/^VmRSS/ { printf "%.0f MB", $2 / 1024 }' "/proc/$service/status"; }

# One request of each kind, so the first measured requests do not pay for start-up.
warm_up() {
  local key=()
  [ -n "${API_KEY:-}" ] && key=(-H "X-Api-Key: $API_KEY")
  for pair in evaluations:demo-corner-local recommendations:demo-recommendation-local reports:demo-report-local; do
    local status
    status=$(curl -s -o /dev/null -w '%{http_code}' -X POST -H 'Content-Type: application/json' -H 'Accept: application/json, text/html' \
      "${key[@]}" --data-binary "@openapi/examples/${pair#*:}.json" "$url/v1/${pair%%:*}")
    echo "warm-up POST /v1/${pair%%:*}: $status"
  done
}

errors=0
# Runs wrk with the mix; prints its summary and adds every answer that is neither a 2xx, a 429 nor (with SHED=1, when
# the rate limits are lifted beyond production) a 503 shed by the work budget to the errors.
mix() {
  local out
  out=$(wrk -t2 -c"$connections" -d"${seconds}s" --timeout 30s -s deploy/load-mix.lua "$url")
  sed -n '/^statuses/,$p' <<<"$out" | sed 's/^/  /'
  local bad
  bad=$(awk -v shed="${SHED:-0}" '/^statuses/ { for (i = 2; i <= NF; i++) { split($i, p, "="); if (p[1] !~ /^2/ && p[1] != 429 && !(shed && p[1] == 503)) n += p[2] } }
             /^socket errors/ { for (i = 3; i <= NF; i++) { split($i, p, "="); n += p[2] } } END { print n + 0 }' <<<"$out")
  echo "  errors (not 2xx, not 429): $bad"
  errors=$((errors + bad))
}

echo "== 1. mix 7:2:1 with production limits, $connections clients, $seconds s"
start_service
warm_up
echo "  RSS before: $(rss_mb)"
mix
echo "  RSS after: $(rss_mb)"
stop_service

echo "== 2. the same mix, rate limits lifted (beyond what production allows: 503 answers shed the excess), $connections clients, $seconds s"
start_service Limits__PermitLimit=1000000000 Limits__KeyPermitLimit=1000000000 Limits__CostlyPermitLimit=1000000000
warm_up
echo "  RSS before: $(rss_mb)"
SHED=1 mix
echo "  RSS after: $(rss_mb)"

echo "== 3. POST /v1/evaluations alone over HTTP, $connections clients, $seconds s (same service process)"
http=$(MIX_EVALUATIONS=1 MIX_RECOMMENDATIONS=0 MIX_REPORTS=0 mix)
echo "$http"
errors=$((errors + $(sed -n 's/^  errors (not 2xx, not 429): //p' <<<"$http")))
echo "  RSS after: $(rss_mb)"
stop_service
http_rate=$(sed -n 's/^  requests .*: \([0-9.]*\) per second$/\1/p' <<<"$http")

echo "== in process, the same evaluation on the same cores, $((seconds / 5 + 1)) s per stage"
inproc=$(dotnet tests/SafetyMirror.Benchmarks/bin/Release/net10.0/SafetyMirror.Benchmarks.dll demo-throughput openapi/examples/demo-corner-local.json $((seconds / 5 + 1)))
sed 's/^/  /' <<<"$inproc"
whole=$(sed -n 's/^whole request in process *\([0-9.]*\) per second$/\1/p' <<<"$inproc")
evaluate=$(sed -n 's/^evaluate *\([0-9.]*\) per second$/\1/p' <<<"$inproc")
awk -v h="$http_rate" -v w="$whole" -v e="$evaluate" 'BEGIN {
  printf "HTTP evaluations against in-process: %.0f%% of the evaluation alone, %.0f%% of the whole request in process\n", 100 * h / e, 100 * h / w }'
echo "errors in all phases: $errors (service log: $log)"
[ "$errors" -eq 0 ]
