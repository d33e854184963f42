#!/usr/bin/env bash
# Times, side by side on the synthetic corpus of bench/GenerateCorpus.java (issue #26): a cold
# `tare scan CORPUS --format json`, a cold `tare check CORPUS --format json` (CORPUS/.tare removed
# before each), and `tare check` again after one template was edited, with the cache the cold check
# left. The edit appends one sentence to one template (a different one each run) and is undone
# afterwards. Each round prints wall time, peak RSS, the run's CPU and other processes' CPU, and the
# end prints the medians and the two ratios issue #26 asks about: cold check over cold scan, and
# check after an edit over cold check. The edited check's findings are checked against a cold check
# of the same edited files, so a warm run must find what a cold one finds.
#
# Environment: JAVA_HOME (run and build with that JDK), BENCH_RUNS (default 3), BENCH_COUNT and
# BENCH_SEED (corpus size and seed, passed to the generator), TARE_JAVA_OPTS (extra JVM options,
# read by the ./tare launcher), BENCH_TARE (the checkout measured; default this one),
# BENCH_VERIFY=0 skips the cold check of the edited files (it doubles the time of a round).
set -euo pipefail

source "$(dirname "${BASH_SOURCE[0]}")/common.sh"
runs="${BENCH_RUNS:-3}"
verify="${BENCH_VERIFY:-1}"
bench_require check.sh
bench_whole_number check.sh BENCH_RUNS "$runs"

cd "$bench_repo"
"$bench_tare/tare" --version >/dev/null
corpus="$(bench_corpus)"
work="$(mktemp -d "${TMPDIR:-/tmp}/tare-bench.XXXXXX")"
bench_templates "$corpus" | grep -v '/partials/' | grep -E '\.(md|txt)$' >"$work/templates" || true
edited=""
restore() {
  if [ -n "$edited" ]; then
    cp "$work/original" "$edited"
  fi
  rm -rf "$corpus/.tare" "$work"
}
trap restore EXIT
bench_templates "$corpus" >"$work/all"
files="$(wc -l <"$work/all")"
bytes="$(bench_bytes "$work/all")"

echo "corpus:  ${corpus#"$bench_repo"/} ($files template files, $bytes bytes)"
bench_machine
echo "commands: ./tare scan CORPUS --format json; ./tare check CORPUS --format json (exit 1 on findings is expected)"
echo
printf '%-18s %8s %13s %7s %12s\n' run wall_s peak_rss_MiB cpu_s other_cpu_s

line() {
  awk -v run="$1" -v wall="$bench_wall" -v rss="$bench_rss_mib" -v cpu="$bench_cpu" -v other="$bench_other_cpu" \
    'BEGIN { printf "%-18s %8.2f %13.0f %7.2f %12.1f\n", run, wall, rss, cpu, other }'
}
# findings FILE: the findings of a JSON check report without the run's own fields, for comparing.
findings() {
  awk '/"findings"/ { on = 1 } on { print }' "$1"
}

scans=()
checks=()
edits=()
count="$(wc -l <"$work/templates")"
for run in $(seq 1 "$runs"); do
  rm -rf "$corpus/.tare"
  bench_time 0 "$work/scan" "$bench_tare/tare" scan "$corpus" --format json
  scans+=("$bench_wall")
  line "$run cold scan"
  rm -rf "$corpus/.tare"
  bench_time "0 1" "$work/check" "$bench_tare/tare" check "$corpus" --format json
  checks+=("$bench_wall")
  line "$run cold check"
  edited="$(sed -n "$(( (run * 7919) % count + 1 ))p" "$work/templates")"
  cp "$edited" "$work/original"
  printf '\nAlways confirm the booking reference before you change a sailing.\n' >>"$edited"
  bench_time "0 1" "$work/edit" "$bench_tare/tare" check "$corpus" --format json
  edits+=("$bench_wall")
  line "$run edited check"
  if [ "$verify" != 0 ]; then
    "$bench_tare/tare" check "$corpus" --format json --no-cache >"$work/edit.cold" || true
    cmp -s <(findings "$work/edit") <(findings "$work/edit.cold") \
      || { echo "check.sh: the check after the edit found other things than a cold check of the same files" >&2; exit 1; }
  fi
  cp "$work/original" "$edited"
  edited=""
done

scan="$(printf '%s\n' "${scans[@]}" | bench_median)"
check="$(printf '%s\n' "${checks[@]}" | bench_median)"
edit="$(printf '%s\n' "${edits[@]}" | bench_median)"
awk -v scan="$scan" -v check="$check" -v edit="$edit" \
  'BEGIN { printf "\nmedian wall: cold scan %.2f s, cold check %.2f s, check after one edit %.2f s\n", scan, check, edit
           printf "cold check / cold scan %.2f (issue #26: at most 2.5); edited check / cold check %.2f (at most 0.15)\n", check / scan, edit / check }'
echo "cpu_s: user + system seconds of the run; other_cpu_s: CPU seconds other processes used meanwhile (near 0 on a quiet machine)"
echo "Times and memory are measurements of this machine at this moment, an estimate of what another run will see."
