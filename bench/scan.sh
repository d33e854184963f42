#!/usr/bin/env bash
# Times a cold `tare scan CORPUS --format json` end to end (JVM start included, CORPUS/.tare removed
# first) on the synthetic corpus of bench/GenerateCorpus.java, a few runs in a row, each followed by
# the same scan warm (from the .tare/cache the cold one left, its output checked byte for byte against
# the cold one's), then `tare scan --help` as often (for scale: a JVM start that builds picocli's
# model of the command and does no work), and prints wall time, throughput
# and peak RSS of each, the medians and the cold/warm ratio. bench/compare.sh times the other
# commands and the reference tokenizer beside it.
#
# Environment: JAVA_HOME (run and build with that JDK), BENCH_RUNS (default 3), BENCH_COUNT and
# BENCH_SEED (corpus size and seed, passed to the generator), TARE_JAVA_OPTS (extra JVM options,
# read by the ./tare launcher), BENCH_TARE (the checkout measured; default this one).
set -euo pipefail

source "$(dirname "${BASH_SOURCE[0]}")/common.sh"
runs="${BENCH_RUNS:-3}"
bench_require scan.sh
bench_whole_number scan.sh BENCH_RUNS "$runs"

cd "$bench_repo"
"$bench_tare/tare" --version >/dev/null
corpus="$(bench_corpus)"
work="$(mktemp -d "${TMPDIR:-/tmp}/tare-bench.XXXXXX")"
trap 'rm -rf "$work"' EXIT
bench_templates "$corpus" >"$work/templates"
files="$(wc -l <"$work/templates")"
bytes="$(bench_bytes "$work/templates")"

echo "corpus:  ${corpus#"$bench_repo"/} ($files template files, $bytes bytes)"
bench_machine
echo "command: ./tare scan ${corpus#"$bench_repo"/} --format json > /dev/null"
echo
printf '%-9s %8s %8s %13s %7s %12s\n' run wall_s MB/s peak_rss_MiB cpu_s other_cpu_s

# line RUN [BYTES]: one row of the table for the run just timed; BYTES defaults to the corpus's (0: no
# throughput, for a run that reads no template).
line() {
  awk -v run="$1" -v wall="$bench_wall" -v bytes="${2:-$bytes}" -v rss="$bench_rss_mib" -v cpu="$bench_cpu" \
    -v other="$bench_other_cpu" \
    'BEGIN { rate = bytes > 0 ? sprintf("%8.1f", bytes / 1e6 / wall) : sprintf("%8s", "-")
             printf "%-9s %8.2f %s %13.0f %7.2f %12.1f\n", run, wall, rate, rss, cpu, other }'
}

walls=()
warm_walls=()
for run in $(seq 1 "$runs"); do
  rm -rf "$corpus/.tare"
  bench_time 0 "$work/scan" "$bench_tare/tare" scan "$corpus" --format json
  walls+=("$bench_wall")
  line "$run cold"
  mv "$work/scan" "$work/scan.cold"
  bench_time 0 "$work/scan" "$bench_tare/tare" scan "$corpus" --format json
  cmp -s "$work/scan.cold" "$work/scan" || { echo "scan.sh: the warm scan printed other bytes than the cold one" >&2; exit 1; }
  warm_walls+=("$bench_wall")
  line "$run warm"
done

# For scale: a JVM start that builds picocli's model of the scan command and renders its usage text,
# with no work.
help_walls=()
for run in $(seq 1 "$runs"); do
  bench_time 0 "$work/help" "$bench_tare/tare" scan --help
  help_walls+=("$bench_wall")
  line "$run help" 0
done

cold="$(printf '%s\n' "${walls[@]}" | bench_median)"
warm="$(printf '%s\n' "${warm_walls[@]}" | bench_median)"
help="$(printf '%s\n' "${help_walls[@]}" | bench_median)"
awk -v wall="$cold" -v warm="$warm" -v help="$help" -v bytes="$bytes" \
  'BEGIN { printf "\nmedian wall cold %.2f s, %.1f MB/s; warm %.2f s; cold/warm %.1f (MB = 10^6 bytes of template files; RSS in MiB, as reported by GNU time)\n", wall, bytes / 1e6 / wall, warm, wall / warm
           printf "for scale, ./tare scan --help (JVM start and the command line, no work): %.2f s\n", help }'
echo "cpu_s: user + system seconds of the run; other_cpu_s: CPU seconds other processes used meanwhile (near 0 on a quiet machine)"
echo "Times and memory are measurements of this machine at this moment, an estimate of what another run will see."
