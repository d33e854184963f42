#!/usr/bin/env bash
# Issue #9's ratios against single-thread jtokkit, measured in pairs: each Tare run is followed at
# once by the yardstick it is compared with (bench.RawJtokkitCount on the same files), and each pair
# gives one ratio. On a machine whose speed drifts from minute to minute (a shared virtual machine),
# the rows of one bench/compare.sh run are minutes apart and their ratio moves with the drift; a pair
# is seconds apart. Prints every pair and the median ratio of each kind:
#   count ENC            ./tare count --tokenizer ENC --format json @LIST, against jtokkit on ENC,
#   count ENC/reference  the same, against the reference tokenizer (npm tiktoken, WASM, in one Node
#                        process: bench/reference/count.mjs), when Node is there,
#   cold scan            ./tare scan CORPUS --format json with CORPUS/.tare removed first, against
#                        jtokkit on every encoding the corpus's targets name (the scan counts them all).
#
# Environment: BENCH_PAIRS (pairs of each kind, default 3), BENCH_COUNT and BENCH_SEED, JAVA_HOME,
# TARE_JAVA_OPTS (JVM options for ./tare), BENCH_TARE (the checkout measured; default this one).
set -euo pipefail

source "$(dirname "${BASH_SOURCE[0]}")/common.sh"
bench_require pairs.sh
pairs="${BENCH_PAIRS:-3}"
bench_whole_number pairs.sh BENCH_PAIRS "$pairs"

cd "$bench_repo"
"$bench_tare/tare" --version >/dev/null
reference=""
if command -v node >/dev/null 2>&1 && command -v npm >/dev/null 2>&1; then
  if [ ! -d bench/reference/node_modules/tiktoken ]; then
    (cd bench/reference && npm ci --no-audit --no-fund >&2)
  fi
  reference=yes
fi
classpath="$(bench_test_classpath)"
corpus="$(bench_corpus)"
work="$(mktemp -d "${TMPDIR:-/tmp}/tare-pairs.XXXXXX")"
trap 'rm -rf "$work"' EXIT
list="$work/templates"
bench_templates "$corpus" >"$list"
encodings=()
while read -r name; do
  case "$name" in o200k_base | cl100k_base | p50k_base | r50k_base) encodings+=("$name") ;; esac
done < <(awk '$1 == "tokenizer:" { print $2 }' "$corpus/tare.yaml" | awk '!seen[$0]++')
[ "${#encodings[@]}" -gt 0 ] || { echo "pairs.sh: the corpus's targets name no built-in encoding" >&2; exit 2; }

echo "corpus:  ${corpus#"$bench_repo"/} ($(wc -l <"$list") template files, $(bench_bytes "$list") bytes)"
bench_machine
echo
printf '%-28s %5s %9s %11s %7s\n' kind pair tare_s yardstick_s ratio

# jtokkit ENC...: the seconds single-thread jtokkit took on ENC... together (the fastest pass of each).
jtokkit() {
  java -cp "$classpath" dev.tare.bench.RawJtokkitCount "$list" "$@" | awk '{ s += $3 } END { print s }'
}

: >"$work/ratios"
pair() {
  local kind="$1" number="$2" tare="$3" yardstick="$4"
  awk -v kind="$kind" -v n="$number" -v t="$tare" -v j="$yardstick" \
    'BEGIN { printf "%-28s %5d %9.2f %11.2f %7.2f\n", kind, n, t, j, j / t }' | tee -a "$work/ratios"
}

for i in $(seq 1 "$pairs"); do
  for name in "${encodings[@]}"; do
    bench_time 0 "$work/count" "$bench_tare/tare" count --tokenizer "$name" --format json "@$list"
    tare_wall="$bench_wall"
    pair "count $name" "$i" "$tare_wall" "$(jtokkit "$name")"
    if [ -n "$reference" ]; then
      bench_time 0 "$work/reference" node bench/reference/count.mjs "$list" "$name"
      pair "count $name/reference" "$i" "$tare_wall" "$bench_wall"
    fi
  done
  rm -rf "$corpus/.tare"
  bench_time 0 "$work/scan" "$bench_tare/tare" scan "$corpus" --format json
  pair "cold scan" "$i" "$bench_wall" "$(jtokkit "${encodings[@]}")"
done

echo
kinds=("${encodings[@]/#/count }")
if [ -n "$reference" ]; then
  for name in "${encodings[@]}"; do kinds+=("count $name/reference"); done
fi
kinds+=("cold scan")
for kind in "${kinds[@]}"; do
  grep -F "$kind " "$work/ratios" | awk '{ print $NF }' | sort -g | awk -v kind="$kind" \
    '{ v[NR] = $1 } END { printf "median ratio, %-28s %.2f (of %d pairs, %.2f to %.2f)\n", kind ":", v[int((NR + 1) / 2)], NR, v[1], v[NR] }'
done
echo "Goals: count at least 8 against the reference (issue #20); at least 1.7 against single-thread jtokkit on two cores (issue #9)."
echo "Times are measurements of this machine at this moment: estimates of what another run will see."
