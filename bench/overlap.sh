#!/usr/bin/env bash
# Times Tare's overlap analysis (the shared blocks behind the shared-block rule of 'tare check') on the
# synthetic corpus of bench/GenerateCorpus.java: bench/Overlap.java reads and parses every template once,
# then runs the analysis over all of them BENCH_RUNS times, printing each run's time; GNU time gives the
# process's peak RSS, and the CPU other processes used meanwhile shows whether the machine was busy.
#
# Environment: JAVA_HOME (run and build with that JDK), BENCH_RUNS (default 3), BENCH_CORPUS (a corpus
# folder; default bench/out/corpus, generated when missing), BENCH_MIN_TOKENS (default 50).
set -euo pipefail

# For bench_whole_number; this script keeps its own JDK and timer checks.
source "$(dirname "${BASH_SOURCE[0]}")/common.sh"

here="$(cd "$(dirname "${BASH_SOURCE[0]}")" && pwd)"
repo="$(cd "$here/.." && pwd)"
runs="${BENCH_RUNS:-3}"
corpus="${BENCH_CORPUS:-$here/out/corpus}"
minimum="${BENCH_MIN_TOKENS:-50}"
timer=/usr/bin/time

if [ -n "${JAVA_HOME:-}" ]; then
  export PATH="$JAVA_HOME/bin:$PATH"
fi
if [ ! -x "$timer" ] || ! "$timer" -v true >/dev/null 2>&1; then
  echo "overlap.sh: GNU time is needed at $timer; install it (on Debian or Ubuntu: sudo apt-get install time) and try again" >&2
  exit 2
fi
bench_whole_number overlap.sh BENCH_RUNS "$runs"

cd "$repo"
./tare --version >/dev/null
if [ ! -f "$corpus/tare.yaml" ]; then
  rm -rf "$corpus.partial"
  mkdir -p "$(dirname "$corpus")"
  echo "generating $corpus ..." >&2
  java "$here/GenerateCorpus.java" "$corpus.partial" >&2
  mv "$corpus.partial" "$corpus"
fi

busy_ticks() {
  awk '/^cpu / { print $2 + $3 + $4 + $7 + $8 + $9 }' /proc/stat
}
report="$(mktemp "${TMPDIR:-/tmp}/tare-overlap.XXXXXX")"
trap 'rm -f "$report"' EXIT

echo "corpus:  $corpus ($(find "$corpus/" -type f | wc -l) files)"
echo "command: java -cp target/tare.jar bench/Overlap.java $corpus $minimum $runs"
before="$(busy_ticks)"
"$timer" -v -o "$report" java -cp target/tare.jar "$here/Overlap.java" "$corpus" "$minimum" "$runs"
after="$(busy_ticks)"
rss_kb="$(awk -F': ' '/Maximum resident set size/ { print $2 }' "$report")"
cpu="$(awk -F': ' '/User time|System time/ { s += $2 } END { print s }' "$report")"
wall="$(awk -F': ' '/Elapsed \(wall clock\)/ { n = split($2, p, ":"); s = 0; for (i = 1; i <= n; i++) s = s * 60 + p[i]; print s }' "$report")"
awk -v rss="$rss_kb" -v cpu="$cpu" -v wall="$wall" -v busy="$(( after - before ))" -v hz="$(getconf CLK_TCK)" \
  'BEGIN { other = busy / hz - cpu; if (other < 0) other = 0
           printf "process: %.1f s wall (reading and parsing included), %.1f CPU-s, peak RSS %.0f MiB; other processes used %.1f CPU-s meanwhile (near 0 on a quiet machine)\n", wall, cpu, rss / 1024, other }'
