#!/usr/bin/env bash
# Times `tare scan CORPUS --format json` end to end (JVM start included) on the synthetic corpus of
# bench/GenerateCorpus.java, a few runs in a row, and prints wall time, throughput and peak RSS.
#
# Environment: JAVA_HOME (run and build with that JDK), BENCH_RUNS (default 3), BENCH_COUNT and
# BENCH_SEED (corpus size and seed, passed to the generator), TARE_JAVA_OPTS (extra JVM options,
# read by the ./tare launcher).
set -euo pipefail

here="$(cd "$(dirname "${BASH_SOURCE[0]}")" && pwd)"
repo="$(cd "$here/.." && pwd)"
out="$here/out"
runs="${BENCH_RUNS:-3}"
count="${BENCH_COUNT:-}"
seed="${BENCH_SEED:-}"
if [ -n "$count" ] || [ -n "$seed" ]; then
  corpus="$out/corpus-${count:-default}-${seed:-default}"
else
  corpus="$out/corpus"
fi
timer=/usr/bin/time

if [ -n "${JAVA_HOME:-}" ]; then
  # The launcher and Maven then both use this JDK.
  export PATH="$JAVA_HOME/bin:$PATH"
fi
if [ ! -x "$timer" ] || ! "$timer" -v true >/dev/null 2>&1; then
  echo "scan.sh: GNU time is needed at $timer; install it (on Debian or Ubuntu: sudo apt-get install time) and try again" >&2
  exit 2
fi
command -v java >/dev/null 2>&1 || { echo "scan.sh: java is not on PATH; install a JDK 17+ or set JAVA_HOME" >&2; exit 2; }
case "$runs" in
  '' | *[!0-9]* | 0) echo "scan.sh: BENCH_RUNS must be a whole number above zero (got '$runs')" >&2; exit 2 ;;
esac

cd "$repo"
./tare --version >/dev/null

# Regenerated when missing or older than the generator; written aside and moved in, so that an
# interrupted generation never leaves a half corpus behind.
if [ ! -f "$corpus/tare.yaml" ] || [ "$here/GenerateCorpus.java" -nt "$corpus/tare.yaml" ]; then
  mkdir -p "$out"
  rm -rf "$corpus" "$corpus.partial"
  echo "generating $corpus ..." >&2
  java "$here/GenerateCorpus.java" "$corpus.partial" ${count:+"$count"} ${seed:+"$seed"} >&2
  mv "$corpus.partial" "$corpus"
fi

files="$(find "$corpus/" -type f | wc -l)"
bytes="$(find "$corpus/" -type f -printf '%s\n' | awk '{ s += $1 } END { print s }')"
report="$(mktemp "${TMPDIR:-/tmp}/tare-bench.XXXXXX")"
errors="$(mktemp "${TMPDIR:-/tmp}/tare-bench-err.XXXXXX")"
trap 'rm -f "$report" "$errors"' EXIT

echo "corpus:  ${corpus#"$repo"/} ($files files, $bytes bytes)"
echo "machine: $(nproc) cores, $(uname -srm), $(java -version 2>&1 | head -n 1)"
if [ -n "${TARE_JAVA_OPTS:-}" ]; then
  echo "jvm options: $TARE_JAVA_OPTS"
fi
echo "command: ./tare scan ${corpus#"$repo"/} --format json > /dev/null"
echo
printf '%-4s %8s %8s %13s %7s %12s\n' run wall_s MB/s peak_rss_MiB cpu_s other_cpu_s

# Busy CPU time of the whole machine so far, in clock ticks: what other processes used during a run
# is this minus the run's own CPU time (a busy machine makes wall times meaningless).
busy_ticks() {
  awk '/^cpu / { print $2 + $3 + $4 + $7 + $8 + $9 }' /proc/stat
}
ticks_per_second="$(getconf CLK_TCK)"

walls=()
for run in $(seq 1 "$runs"); do
  before="$(busy_ticks)"
  if ! "$timer" -v -o "$report" ./tare scan "$corpus" --format json >/dev/null 2>"$errors"; then
    cat "$errors" >&2
    echo "scan.sh: run $run of tare scan failed (see above)" >&2
    exit 1
  fi
  after="$(busy_ticks)"
  wall="$(awk -F': ' '/Elapsed \(wall clock\)/ { n = split($2, p, ":"); s = 0; for (i = 1; i <= n; i++) s = s * 60 + p[i]; print s }' "$report")"
  rss_kb="$(awk -F': ' '/Maximum resident set size/ { print $2 }' "$report")"
  cpu="$(awk -F': ' '/User time|System time/ { s += $2 } END { print s }' "$report")"
  walls+=("$wall")
  awk -v run="$run" -v wall="$wall" -v bytes="$bytes" -v rss="$rss_kb" -v cpu="$cpu" \
    -v busy="$(( after - before ))" -v hz="$ticks_per_second" \
    'BEGIN { other = busy / hz - cpu; if (other < 0) other = 0
             printf "%-4s %8.2f %8.1f %13.0f %7.1f %12.1f\n", run, wall, bytes / 1e6 / wall, rss / 1024, cpu, other }'
done

median="$(printf '%s\n' "${walls[@]}" | sort -g | awk '{ w[NR] = $1 } END { print (NR % 2) ? w[(NR + 1) / 2] : (w[NR / 2] + w[NR / 2 + 1]) / 2 }')"
awk -v wall="$median" -v bytes="$bytes" \
  'BEGIN { printf "\nmedian wall %.2f s, %.1f MB/s (MB = 10^6 bytes; RSS in MiB, as reported by GNU time)\n", wall, bytes / 1e6 / wall }'
echo "cpu_s: user + system seconds of the run; other_cpu_s: CPU seconds other processes used meanwhile (near 0 on a quiet machine)"
