#!/usr/bin/env bash
# Times what source files without prompts add to a cold scan (issue #25): the synthetic template
# corpus of bench/GenerateCorpus.java alone, and a copy of it with BENCH_SOURCES source files of
# bench/GenerateSources.java beside the templates (Python, TypeScript, Java and Go in equal numbers,
# none holding a prompt), each scanned cold in turn (.tare removed first). The end prints the
# medians and their difference, and checks that both scans measured the same templates.
#
# Environment: JAVA_HOME (run and build with that JDK), BENCH_RUNS (default 5), BENCH_SOURCES
# (default 10000), BENCH_COUNT and BENCH_SEED (template corpus size and seed; default 2000 templates),
# TARE_JAVA_OPTS (extra JVM options, read by the ./tare launcher), BENCH_TARE (the checkout measured).
set -euo pipefail

source "$(dirname "${BASH_SOURCE[0]}")/common.sh"
runs="${BENCH_RUNS:-5}"
sources="${BENCH_SOURCES:-10000}"
export BENCH_COUNT="${BENCH_COUNT:-2000}"
bench_require code.sh
bench_whole_number code.sh BENCH_RUNS "$runs"
bench_whole_number code.sh BENCH_SOURCES "$sources"

cd "$bench_repo"
"$bench_tare/tare" --version >/dev/null
corpus="$(bench_corpus)"
with="$bench_out/$(basename "$corpus")-with-$sources-sources"
if [ ! -f "$with/tare.yaml" ] || [ "$corpus/tare.yaml" -nt "$with/tare.yaml" ] \
    || [ "$bench_here/GenerateSources.java" -nt "$with/tare.yaml" ]; then
  rm -rf "$with" "$with.partial"
  cp -r "$corpus" "$with.partial"
  rm -rf "$with.partial/.tare"
  java "$bench_here/GenerateSources.java" "$with.partial" "$sources" >&2
  mv "$with.partial" "$with"
fi
work="$(mktemp -d "${TMPDIR:-/tmp}/tare-bench.XXXXXX")"
trap 'rm -rf "$work" "$corpus/.tare" "$with/.tare"' EXIT
source_bytes="$(find "$with/src" -type f | LC_ALL=C sort >"$work/sources"; bench_bytes "$work/sources")"

echo "corpus:  ${corpus#"$bench_repo"/} ($(bench_templates "$corpus" | wc -l) template files)"
echo "with:    ${with#"$bench_repo"/} (the same, and $sources source files without prompts, $source_bytes bytes)"
bench_machine
echo "command: ./tare scan FOLDER --format json, FOLDER/.tare removed first"
echo
printf '%-22s %8s %13s %7s %12s\n' run wall_s peak_rss_MiB cpu_s other_cpu_s

line() {
  awk -v run="$1" -v wall="$bench_wall" -v rss="$bench_rss_mib" -v cpu="$bench_cpu" -v other="$bench_other_cpu" \
    'BEGIN { printf "%-22s %8.2f %13.0f %7.2f %12.1f\n", run, wall, rss, cpu, other }'
}
# measured FILE: the number of templates a JSON scan report measured.
measured() {
  grep -c '"static_tokens"' "$1" || true
}

alone=()
both=()
for run in $(seq 1 "$runs"); do
  rm -rf "$corpus/.tare"
  bench_time 0 "$work/alone" "$bench_tare/tare" scan "$corpus" --format json
  line "$run templates only"
  alone+=("$bench_wall")
  rm -rf "$with/.tare"
  bench_time 0 "$work/both" "$bench_tare/tare" scan "$with" --format json
  line "$run with sources"
  both+=("$bench_wall")
done

if [ "$(measured "$work/alone")" != "$(measured "$work/both")" ]; then
  echo "code.sh: the scan with source files measured $(measured "$work/both") templates, without them $(measured "$work/alone"); a generated source file was taken for a prompt" >&2
  exit 1
fi
a="$(printf '%s\n' "${alone[@]}" | bench_median)"
b="$(printf '%s\n' "${both[@]}" | bench_median)"
echo
awk -v a="$a" -v b="$b" -v n="$sources" 'BEGIN { printf "median wall: templates only %.2f s, with %d source files %.2f s; the source files add %.2f s (issue #25: at most 1 s)\n", a, n, b, b - a }'
echo "both scans measured $(measured "$work/alone") templates"
echo "cpu_s: user + system seconds of the run; other_cpu_s: CPU seconds other processes used meanwhile (near 0 on a quiet machine)"
echo "Times and memory are measurements of this machine at this moment, an estimate of what another run will see."
