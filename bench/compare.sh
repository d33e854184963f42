#!/usr/bin/env bash
# Side-by-side benchmark, on one machine in one run: generates the synthetic corpus (GenerateCorpus.java),
# then times end to end with GNU time (process start included)
#   tare scan --format json, cold (CORPUS/.tare removed first) and warm (the same again, a few times,
#     checked byte for byte against the cold output),
#   tare check --format json, cold and warm (checked byte for byte against the cold output), tare fix --dry-run,
#   tare count over every template file (one @-file of paths), once per tokenizer tare.yaml names,
#   the reference tokenizer (npm tiktoken, WASM) counting the same files in one Node process
#     (bench/reference/count.mjs), per encoding and all encodings in one process,
# and single-thread jtokkit counting the same texts inside one warmed-up JVM (RawJtokkitCount; no JVM
# start, no reading). Prints one table: wall seconds, MB/s, peak RSS, CPU, other processes' CPU,
# token totals, and throughput ratios against the reference and against single-thread jtokkit.
#
# Environment: BENCH_COUNT (templates, default 20,000) and BENCH_SEED, BENCH_WARM_RUNS (warm scans
# timed, default 5, median), JAVA_HOME, TARE_JAVA_OPTS (JVM options for ./tare). Needs GNU time,
# Maven, Node and npm (`npm ci` runs in bench/reference when its node_modules is missing).
set -euo pipefail

source "$(dirname "${BASH_SOURCE[0]}")/common.sh"
bench_require compare.sh
command -v node >/dev/null 2>&1 && command -v npm >/dev/null 2>&1 \
  || { echo "compare.sh: Node and npm are needed for the reference tokenizer; install them and try again" >&2; exit 2; }

cd "$bench_repo"
./tare --version >/dev/null
classpath="$(bench_test_classpath)"
if [ ! -d bench/reference/node_modules/tiktoken ]; then
  (cd bench/reference && npm ci --no-audit --no-fund >&2)
fi
corpus="$(bench_corpus)"
work="$(mktemp -d "${TMPDIR:-/tmp}/tare-compare.XXXXXX")"
trap 'rm -rf "$work"' EXIT
list="$work/templates"
bench_templates "$corpus" >"$list"
files="$(wc -l <"$list")"
bytes="$(bench_bytes "$list")"

# The tokenizers the corpus's targets name, each once; the reference and jtokkit know the built-in ones.
tokenizers=()
encodings=()
while read -r name; do
  tokenizers+=("$name")
  case "$name" in
    o200k_base | cl100k_base | p50k_base | r50k_base) encodings+=("$name") ;;
  esac
done < <(awk '$1 == "tokenizer:" { print $2 }' "$corpus/tare.yaml" | awk '!seen[$0]++')

names=() walls=() rsss=() cpus=() others=() tokens=()
row() {
  names+=("$1") walls+=("$2") rsss+=("$3") cpus+=("$4") others+=("$5") tokens+=("${6:--}")
}
timed() {
  echo "timing $1 ..." >&2
}

# cold_and_warm NAME EXITS COMMAND...: times COMMAND once cold (row "NAME, cold") and then warm, from
# what the cold run left in .tare/cache. A warm run takes a fraction of a second, so one run says
# little: the warm row is the median of a few (its other columns are that run's), and every warm
# run must print the cold run's bytes.
warm_runs="${BENCH_WARM_RUNS:-5}"
cold_and_warm() {
  local name="$1" exits="$2" wall rss cpu other
  shift 2
  timed "$name, cold"
  bench_time "$exits" "$work/out" "$@"
  row "$name, cold" "$bench_wall" "$bench_rss_mib" "$bench_cpu" "$bench_other_cpu"
  cp "$work/out" "$work/out.cold"
  timed "$name, warm (median of $warm_runs)"
  : >"$work/warm"
  for _ in $(seq 1 "$warm_runs"); do
    bench_time "$exits" "$work/out" "$@"
    cmp -s "$work/out.cold" "$work/out" || { echo "compare.sh: the warm $name printed other bytes than the cold one" >&2; exit 1; }
    printf '%s\t%s\t%s\t%s\n' "$bench_wall" "$bench_rss_mib" "$bench_cpu" "$bench_other_cpu" >>"$work/warm"
  done
  IFS=$'\t' read -r wall rss cpu other < <(sort -g "$work/warm" | sed -n "$(( (warm_runs + 1) / 2 ))p")
  row "$name, warm" "$wall" "$rss" "$cpu" "$other"
}

rm -rf "$corpus/.tare"
cold_and_warm "tare scan" 0 ./tare scan "$corpus" --format json
# The scan's caches do not serve the check: its first run is cold.
cold_and_warm "tare check" "0 1" ./tare check "$corpus" --format json
timed "tare fix --dry-run"
bench_time "0 1" "$work/fix" ./tare fix "$corpus" --dry-run
row "tare fix --dry-run" "$bench_wall" "$bench_rss_mib" "$bench_cpu" "$bench_other_cpu"

total_tokens() {
  node -e 'const j = JSON.parse(require("fs").readFileSync(0, "utf8")); console.log(j.total.tokens)' <"$1"
}
for name in "${tokenizers[@]}"; do
  spec="$name"
  case "$name" in
    o200k_base | cl100k_base | p50k_base | r50k_base | /*) ;;
    *) spec="$corpus/$name" ;;  # a tokenizer.json path, relative to tare.yaml
  esac
  timed "tare count $name"
  bench_time 0 "$work/count" ./tare count --tokenizer "$spec" --format json "@$list"
  row "tare count $name" "$bench_wall" "$bench_rss_mib" "$bench_cpu" "$bench_other_cpu" "$(total_tokens "$work/count")"
done

for name in "${encodings[@]}"; do
  timed "reference $name"
  bench_time 0 "$work/reference" node bench/reference/count.mjs "$list" "$name"
  row "reference $name" "$bench_wall" "$bench_rss_mib" "$bench_cpu" "$bench_other_cpu" "$(awk '{ print $2 }' "$work/reference")"
done
if [ "${#encodings[@]}" -gt 1 ]; then
  timed "reference, all encodings"
  bench_time 0 "$work/reference" node bench/reference/count.mjs "$list" "${encodings[@]}"
  row "reference, all encodings" "$bench_wall" "$bench_rss_mib" "$bench_cpu" "$bench_other_cpu"
fi

if [ "${#encodings[@]}" -gt 0 ]; then
  timed "jtokkit, one thread"
  bench_time 0 "$work/raw" java -cp "$classpath" dev.tare.bench.RawJtokkitCount "$list" "${encodings[@]}"
  while read -r name count seconds; do
    row "jtokkit 1 thread $name *" "$seconds" "$bench_rss_mib" - - "$count"
  done <"$work/raw"
  if [ "${#encodings[@]}" -gt 1 ]; then
    row "jtokkit 1 thread, all *" "$(awk '{ s += $3 } END { print s }' "$work/raw")" "$bench_rss_mib" - -
  fi
fi

echo "corpus:  ${corpus#"$bench_repo"/} ($files template files, $bytes bytes; tokenizers: ${tokenizers[*]})"
bench_machine
echo
{
  for i in "${!names[@]}"; do
    printf '%s\t%s\t%s\t%s\t%s\t%s\n' "${names[$i]}" "${walls[$i]}" "${rsss[$i]}" "${cpus[$i]}" "${others[$i]}" "${tokens[$i]}"
  done
} | awk -F'\t' -v bytes="$bytes" '
  { name[NR] = $1; wall[NR] = $2; rss[NR] = $3; cpu[NR] = $4; other[NR] = $5; tok[NR] = $6
    rate[NR] = bytes / 1e6 / $2; by[$1] = NR }
  function ratio(i, against) { return (against in by) ? sprintf("%.2f", rate[i] / rate[by[against]]) : "-" }
  END {
    printf "%-30s %8s %8s %13s %7s %12s %12s %7s %7s\n", "row", "wall_s", "MB/s", "peak_rss_MiB", "cpu_s", "other_cpu_s", "tokens", "vs_ref", "vs_raw"
    for (i = 1; i <= NR; i++) {
      ref = "-"; raw = "-"
      if (name[i] ~ /^tare count /) {
        enc = substr(name[i], 12)
        ref = ratio(i, "reference " enc); raw = ratio(i, "jtokkit 1 thread " enc " *")
      } else if (name[i] ~ /^tare scan/) {
        all = ("reference, all encodings" in by) ? "reference, all encodings" : ""
        for (j = 1; j <= NR && all == ""; j++) if (name[j] ~ /^reference /) all = name[j]
        rawall = ("jtokkit 1 thread, all *" in by) ? "jtokkit 1 thread, all *" : ""
        for (j = 1; j <= NR && rawall == ""; j++) if (name[j] ~ /^jtokkit 1 thread /) rawall = name[j]
        ref = ratio(i, all); raw = ratio(i, rawall)
      }
      printf "%-30s %8.2f %8.1f %13s %7s %12s %12s %7s %7s\n", name[i], wall[i], rate[i], rss[i], cpu[i], other[i], tok[i], ref, raw
      if (other[i] != "-") busy += other[i]
    }
    if (("tare scan, cold" in by) && ("tare scan, warm" in by))
      printf "\nwarm scan: %.1f times faster than the cold one (issue #9 asks for at least 20)\n", wall[by["tare scan, cold"]] / wall[by["tare scan, warm"]]
    if (("tare check, cold" in by) && ("tare check, warm" in by))
      printf "warm check: %.1f times faster than the cold one\n", wall[by["tare check, cold"]] / wall[by["tare check, warm"]]
    printf "\nother processes used %.1f CPU-s during the timed rows (near 0 on a quiet machine)\n", busy
  }'

# The same text counted by tare, the reference and jtokkit must give the same total.
agree=yes
for name in "${encodings[@]}"; do
  seen="$(for i in "${!names[@]}"; do
    case "${names[$i]}" in "tare count $name" | "reference $name" | "jtokkit 1 thread $name *") echo "${tokens[$i]}" ;; esac
  done | sort -u | wc -l)"
  if [ "$seen" -ne 1 ]; then
    agree=no
    echo "WARNING: the token totals of $name differ between tare count, the reference and jtokkit" >&2
  fi
done
[ "$agree" = yes ] && echo "token totals agree on every encoding (tare count, reference, jtokkit)"
cat <<EOF
MB = 10^6 bytes of the $files template files every row reads. Wall time and peak RSS (MiB) are GNU time's
for the whole process, JVM or Node start included; the rows marked * time counting alone inside one
warmed-up JVM (no start, no reading), beside that process's peak RSS.
vs_ref: throughput over the reference's on the same work (tare count ENC against reference ENC; tare scan
against the reference counting every encoding in one process). vs_raw: the same against single-thread
jtokkit. Issue #9 asks for at least 3 against the reference, 1.7 against single-thread jtokkit on two
cores, and a peak RSS of at most 512 MiB.
check runs after the two scans (the scan's caches do not serve it: the first check is cold), then again
warm; fix runs last.
Times and memory are measurements of this machine at this moment: estimates of what another run will see.
EOF
