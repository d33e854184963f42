#!/usr/bin/env bash
# Times the pre-commit hook against `tare count` on one small file, JVM start included.
#
# Makes a temporary git repository from the demo (tare.yaml with its three targets, partials, rule
# packs, tokenizer file and tool files committed), stages 10 of its templates, installs Tare's hook,
# and then times, in interleaved rounds (BENCH_RUNS, default 10; medians reported):
#   hook script    .git/hooks/pre-commit as installed by ./tare hook install, exactly what git runs
#                  (the ./tare launcher, with its JVM options, then hook run)
#   jar hook run   java -jar target/tare.jar hook run --timings (no archive)
#   ./tare hook    ./tare hook run --timings (the launcher, with its JVM options)
#   jar count      java -jar target/tare.jar count --timings SMALL (no archive)
#   ./tare count   ./tare count --timings SMALL
# and prints each one's median wall time and CPU time, the median --timings breakdown where there is
# one, the hook-to-count ratios, and the CPU other processes used meanwhile (a busy machine shows).
# The hook exits 1 here: the demo's templates carry planted findings, so the time includes the report.
#
# BENCH_OPTIONS adds rows that compare JVM options: 'LABEL=OPTIONS;LABEL=OPTIONS...' times
# java OPTIONS -jar target/tare.jar hook run --timings for each (OPTIONS may be empty).
#
# Environment: JAVA_HOME (run, and build if needed, with that JDK), BENCH_RUNS, BENCH_OPTIONS, BENCH_TARE
# (the checkout measured; default this one).
set -euo pipefail

# For bench_whole_number; this script keeps its own JDK and timer checks.
source "$(dirname "${BASH_SOURCE[0]}")/common.sh"

here="$(cd "$(dirname "${BASH_SOURCE[0]}")" && pwd)"
# BENCH_TARE names another checkout to measure (bench/side-by-side.sh); the demo is that checkout's.
project="$(cd "${BENCH_TARE:-$here/..}" && pwd)"
runs="${BENCH_RUNS:-10}"
timer=/usr/bin/time
small=prompts/meters/reread-confirmation.txt
staged=(prompts/system/after-hours.md prompts/system/assistant.md prompts/leaks/leak-followup.chat.yaml
  prompts/leaks/leak-triage.md prompts/connections/connection-checklist.chat.json prompts/tools/lookup-account.md
  prompts/outages/outage-status.md prompts/billing/high-bill-review.chat.json prompts/billing/explain-bill.md
  prompts/quality/quality-notice.md)

if [ -n "${JAVA_HOME:-}" ]; then
  export PATH="$JAVA_HOME/bin:$PATH"
fi
if [ ! -x "$timer" ] || ! "$timer" -f %e true >/dev/null 2>&1; then
  echo "hook.sh: GNU time is needed at $timer; install it (on Debian or Ubuntu: sudo apt-get install time) and try again" >&2
  exit 2
fi
command -v java >/dev/null 2>&1 || { echo "hook.sh: java is not on PATH; install a JDK 17+ or set JAVA_HOME" >&2; exit 2; }
command -v git >/dev/null 2>&1 || { echo "hook.sh: git is needed; install it and try again" >&2; exit 2; }
bench_whole_number hook.sh BENCH_RUNS "$runs"

"$project/tare" --version >/dev/null
jar="$project/target/tare.jar"
java="$(command -v java)"

work="$(mktemp -d "${TMPDIR:-/tmp}/tare-hook-bench.XXXXXX")"
trap 'rm -rf "$work"' EXIT
repo="$work/repo"
mkdir -p "$repo/prompts"
demo="$project/corpora/demo"
cp -R "$demo/tare.yaml" "$demo/models" "$demo/rules" "$demo/tools" "$repo/"
cp -R "$demo/prompts/partials" "$repo/prompts/"
g() { git -C "$repo" -c user.name=bench -c user.email=bench@example.invalid -c commit.gpgsign=false "$@" >/dev/null; }
g init -q
g add -A
g commit -q --no-verify -m "configuration, partials, rule packs, tools"
for file in "${staged[@]}"; do
  mkdir -p "$repo/$(dirname "$file")"
  cp "$demo/$file" "$repo/$file"
done
mkdir -p "$repo/$(dirname "$small")"
cp "$demo/$small" "$repo/$small"
g add "${staged[@]}"
(cd "$repo" && "$project/tare" hook install >/dev/null)
hook="$(cd "$repo" && realpath "$(git rev-parse --git-path hooks/pre-commit)")"

labels=("hook script" "jar hook run" "./tare hook" "jar count" "./tare count")
commands=("sh $hook"
  "$java -jar $jar hook run --timings"
  "$project/tare hook run --timings"
  "$java -jar $jar count --timings $small"
  "$project/tare count --timings $small")
if [ -n "${BENCH_OPTIONS:-}" ]; then
  IFS=';' read -r -a variants <<<"$BENCH_OPTIONS"
  for variant in "${variants[@]}"; do
    labels+=("${variant%%=*}")
    commands+=("$java ${variant#*=} -jar $jar hook run --timings")
  done
fi

busy_ticks() {
  awk '/^cpu / { print $2 + $3 + $4 + $7 + $8 + $9 }' /proc/stat
}
ticks_per_second="$(getconf CLK_TCK)"

echo "repository: 10 staged templates ($(cd "$repo" && cat "${staged[@]}" | wc -c) bytes), 3 targets (two built-in encodings, one tokenizer.json)"
echo "small file: $small ($(wc -c <"$repo/$small") bytes)"
echo "tare:       $project ($(git -C "$project" rev-parse --short HEAD 2>/dev/null || echo "not a git checkout"))"
echo "machine:    $(nproc) cores, $(uname -srm), $(java -version 2>&1 | head -n 1)"
echo "hook:       $(tail -n 1 "$hook")"
echo "runs:       $runs of each, interleaved; medians"
echo

results="$work/results"
mkdir -p "$results"
other_total=0
for run in $(seq 1 "$runs"); do
  for i in "${!labels[@]}"; do
    before="$(busy_ticks)"
    set +e
    (set -f; cd "$repo" && "$timer" -f '%e %U %S' -o "$work/time" ${commands[$i]} >/dev/null 2>"$work/err")
    status=$?
    set -e
    after="$(busy_ticks)"
    if [ "$status" -gt 1 ]; then
      cat "$work/err" >&2
      echo "hook.sh: '${commands[$i]}' failed with exit code $status (see above)" >&2
      exit 1
    fi
    read -r wall user system < <(tail -n 1 "$work/time")
    cpu="$(awk -v u="$user" -v s="$system" 'BEGIN { print u + s }')"
    echo "$wall" >>"$results/$i.wall"
    echo "$cpu" >>"$results/$i.cpu"
    other_total="$(awk -v t="$other_total" -v b="$(( after - before ))" -v hz="$ticks_per_second" -v c="$cpu" \
      'BEGIN { o = b / hz - c; if (o < 0) o = 0; print t + o }')"
    line="$(grep '^timings:' "$work/err" || true)"
    if [ -n "$line" ]; then
      for part in start "tokenizer load" work; do
        echo "$line" | sed -n "s/.*$part \([0-9]*\) ms.*/\1/p" >>"$results/$i.$part"
      done
      echo "$line" | sed -n 's/.*class-data archive: //p' >"$results/$i.archive"
    fi
  done
done

printf '%-20s %8s %7s %9s %15s %9s  %s\n' command wall_s cpu_s start_ms tokenizer_ms work_ms class-data-archive
for i in "${!labels[@]}"; do
  wall="$(bench_median <"$results/$i.wall")"
  printf '%-20s %8.2f %7.2f' "${labels[$i]}" "$wall" "$(bench_median <"$results/$i.cpu")"
  if [ -f "$results/$i.start" ]; then
    printf ' %9s %15s %9s  %s\n' "$(bench_median <"$results/$i.start")" "$(bench_median <"$results/$i.tokenizer load")" \
      "$(bench_median <"$results/$i.work")" "$(cat "$results/$i.archive")"
  else
    printf ' %9s %15s %9s  %s\n' - - - "as installed"
  fi
  eval "wall_$i=$wall"
done
echo
awk -v h="$wall_0" -v c="$wall_4" -v jh="$wall_1" -v jc="$wall_3" 'BEGIN {
  printf "ratio hook script / ./tare count: %.2f (goal: at most 1.3; the hook script at most 0.6 s wall, issue #20)\n", h / c
  printf "ratio jar hook run / jar count:   %.2f\n", jh / jc }'
awk -v o="$other_total" -v n="$(( runs * ${#labels[@]} ))" \
  'BEGIN { printf "other processes used %.1f CPU-s during the %d timed runs (near 0 on a quiet machine)\n", o, n }'
