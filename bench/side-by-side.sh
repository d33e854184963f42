#!/usr/bin/env bash
# Measures two builds of Tare in one run: this checkout and OTHER (another checkout, such as a
# worktree of the commit before a change: git worktree add --detach ../before REV), each benchmark
# script run on OTHER and then on this checkout, round after round, so that both see the same machine
# minutes. The scripts are this checkout's, the builds are each checkout's own (BENCH_TARE).
#
#   bash bench/side-by-side.sh OTHER [SCRIPT...]     (default scripts: pairs.sh hook.sh)
#
# Environment: BENCH_ROUNDS (rounds, default 1), and whatever the scripts read (BENCH_PAIRS,
# BENCH_RUNS, BENCH_COUNT, JAVA_HOME, ...).
set -euo pipefail

source "$(dirname "${BASH_SOURCE[0]}")/common.sh"
[ "$#" -ge 1 ] || { echo "usage: bash bench/side-by-side.sh OTHER_CHECKOUT [SCRIPT...]" >&2; exit 2; }
other="$1"
shift
[ -x "$other/tare" ] || { echo "side-by-side.sh: $other has no ./tare launcher; give the path of another Tare checkout" >&2; exit 2; }
other="$(cd "$other" && pwd)"
scripts=("$@")
[ "${#scripts[@]}" -gt 0 ] || scripts=(pairs.sh hook.sh)
for script in "${scripts[@]}"; do
  [ -f "$bench_here/$script" ] || { echo "side-by-side.sh: no script bench/$script" >&2; exit 2; }
done
rounds="${BENCH_ROUNDS:-1}"
bench_whole_number side-by-side.sh BENCH_ROUNDS "$rounds"

for round in $(seq 1 "$rounds"); do
  for script in "${scripts[@]}"; do
    for checkout in "$other" "$bench_repo"; do
      echo "=== round $round, bench/$script, $checkout ($(git -C "$checkout" rev-parse --short HEAD 2>/dev/null || echo "?"))"
      BENCH_TARE="$checkout" bash "$bench_here/$script"
      echo
    done
  done
done
