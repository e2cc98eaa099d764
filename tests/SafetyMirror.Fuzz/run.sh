#!/usr/bin/env bash
# Coverage-guided fuzzing of the readers (SharpFuzz + Debian's afl++), bounded in time.
# Usage: tests/SafetyMirror.Fuzz/run.sh [seconds per target, default 60] [targets, default "plan request"]
# Builds the harness, instruments SafetyMirror.Core and SafetyMirror.Api, runs afl-fuzz on each target from its
# committed seed corpus (corpus/TARGET), and exits 1 if afl found a crash (an exception escaping a reader). Each
# crash is copied to crashes/TARGET/, where the regression test FuzzCrashesTests replays it, and replayed here once
# so its stack trace is printed. Findings of the run stay in artifacts/fuzz/findings.
set -euo pipefail
here=$(cd "$(dirname "$0")" && pwd)
root=$(cd "$here/../.." && pwd)
seconds=${1:-60}
targets=${2:-plan request}
plain=$root/artifacts/fuzz/plain
instrumented=$root/artifacts/fuzz/instrumented
findings=$root/artifacts/fuzz/findings

command -v afl-fuzz >/dev/null || { echo "afl-fuzz is missing: apt-get install -y afl++" >&2; exit 2; }
(cd "$here" && dotnet tool restore >/dev/null)

# A fresh copy each run: SharpFuzz refuses an assembly it has already instrumented. The plain copy replays crashes:
# instrumented code run outside afl writes to a coverage map that is not there.
rm -rf "$plain" "$instrumented" "$findings"
mkdir -p "$findings"
dotnet publish "$here/SafetyMirror.Fuzz.csproj" -c Release -o "$plain" -v q -nologo >/dev/null
cp -r "$plain" "$instrumented"
for assembly in SafetyMirror.Core SafetyMirror.Api; do
  (cd "$here" && dotnet sharpfuzz "$instrumented/$assembly.dll" >/dev/null)
done

# dotnet is not an afl-instrumented binary (SharpFuzz reports coverage itself); the machine is shared, so no
# CPU governor check and no core pinning; hangs (slow inputs) are not counted as crashes here.
export AFL_SKIP_BIN_CHECK=1 AFL_SKIP_CPUFREQ=1 AFL_NO_AFFINITY=1 AFL_NO_UI=1 \
  AFL_I_DONT_CARE_ABOUT_MISSING_CRASHES=1 AFL_FORKSRV_INIT_TMOUT=30000
status=0
for target in $targets; do
  afl-fuzz -i "$here/corpus/$target" -o "$findings/$target" -V "$seconds" -t 5000 -m none \
    -- "$(command -v dotnet)" "$instrumented/SafetyMirror.Fuzz.dll" "$target" >"$findings.$target.log" 2>&1 \
    || { echo "afl-fuzz failed on $target; its log:" >&2; tail -30 "$findings.$target.log" >&2; exit 2; }
  stats=$findings/$target/default/fuzzer_stats
  echo "$target: $(sed -n 's/^execs_done *: //p' "$stats") executions, $(sed -n 's/^corpus_count *: //p' "$stats") paths, $(sed -n 's/^saved_crashes *: //p' "$stats") crashes, $(sed -n 's/^saved_hangs *: //p' "$stats") hangs in ${seconds} s"
  for crash in "$findings/$target"/default/crashes/id:*; do
    [ -f "$crash" ] || continue
    status=1
    kept=$here/crashes/$target/$(sha1sum "$crash" | cut -c1-16).json
    mkdir -p "$(dirname "$kept")"
    cp "$crash" "$kept"
    echo "CRASH in $target, kept as ${kept#"$root"/}; its bytes in base64, to recover it from a CI log:" >&2
    base64 -w0 "$crash" >&2
    echo >&2
    dotnet "$plain/SafetyMirror.Fuzz.dll" "$target" "$kept" 2>&1 | grep -v '^   at System\.' | head -12 >&2 || true
  done
done
exit "$status"
