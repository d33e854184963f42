# Shared pieces of the benchmark scripts (sourced, not run): the JDK and GNU time checks, the synthetic
# corpus of bench/GenerateCorpus.java, the test class path, and timing one command end to end.
#
# Environment: JAVA_HOME (run and build with that JDK), BENCH_COUNT and BENCH_SEED (corpus size and
# seed, passed to the generator), TARE_JAVA_OPTS (extra JVM options, read by the ./tare launcher),
# BENCH_TARE (the checkout whose ./tare is measured; default this one).

bench_here="$(cd "$(dirname "${BASH_SOURCE[0]}")" && pwd)"
bench_repo="$(cd "$bench_here/.." && pwd)"
# The checkout whose Tare is measured: BENCH_TARE, else this one (bench/side-by-side.sh sets it to
# measure two builds in one run). The corpus, the yardsticks and the scripts stay this checkout's.
bench_tare="$(cd "${BENCH_TARE:-$bench_repo}" && pwd)"
bench_out="$bench_here/out"
bench_timer=/usr/bin/time

# bench_require NAME: the JDK and GNU time are there (NAME prefixes the messages).
bench_require() {
  local name="$1"
  if [ -n "${JAVA_HOME:-}" ]; then
    # The launcher and Maven then both use this JDK.
    export PATH="$JAVA_HOME/bin:$PATH"
  fi
  if [ ! -x "$bench_timer" ] || ! "$bench_timer" -v true >/dev/null 2>&1; then
    echo "$name: GNU time is needed at $bench_timer; install it (on Debian or Ubuntu: sudo apt-get install time) and try again" >&2
    exit 2
  fi
  command -v java >/dev/null 2>&1 || { echo "$name: java is not on PATH; install a JDK 17+ or set JAVA_HOME" >&2; exit 2; }
}

# bench_whole_number SCRIPT SETTING VALUE: exits with 2 and says so unless VALUE, the value of the
# environment setting SETTING, is a whole number above zero (SCRIPT prefixes the message).
bench_whole_number() {
  case "$3" in
    '' | *[!0-9]* | 0) echo "$1: $2 must be a whole number above zero (got '$3')" >&2; exit 2 ;;
  esac
}

# bench_corpus: prints the corpus folder for BENCH_COUNT and BENCH_SEED, generating it first when it is
# missing or older than the generator. It is written aside and moved in, so that an interrupted
# generation never leaves a half corpus behind.
bench_corpus() {
  local count="${BENCH_COUNT:-}" seed="${BENCH_SEED:-}" corpus
  if [ -n "$count" ] || [ -n "$seed" ]; then
    corpus="$bench_out/corpus-${count:-default}-${seed:-default}"
  else
    corpus="$bench_out/corpus"
  fi
  if [ ! -f "$corpus/tare.yaml" ] || [ "$bench_here/GenerateCorpus.java" -nt "$corpus/tare.yaml" ]; then
    mkdir -p "$bench_out"
    rm -rf "$corpus" "$corpus.partial"
    echo "generating $corpus ..." >&2
    java "$bench_here/GenerateCorpus.java" "$corpus.partial" ${count:+"$count"} ${seed:+"$seed"} >&2
    mv "$corpus.partial" "$corpus"
  fi
  echo "$corpus"
}

# bench_templates CORPUS: the corpus's template files (what its tare.yaml includes), one absolute path a
# line, sorted.
bench_templates() {
  find "$1/prompts" -type f \( -name '*.md' -o -name '*.txt' -o -name '*.chat.yaml' -o -name '*.chat.json' \) | LC_ALL=C sort
}

# bench_bytes LIST: the total size in bytes of the files listed.
bench_bytes() {
  tr '\n' '\0' <"$1" | xargs -0 stat -c '%s' | awk '{ s += $1 } END { print s + 0 }'
}

# bench_machine: one line about the machine and the JDK.
bench_machine() {
  echo "tare:    $bench_tare ($(git -C "$bench_tare" rev-parse --short HEAD 2>/dev/null || echo "not a git checkout"))"
  echo "machine: $(nproc) cores, $(awk '/MemTotal/ { printf "%.1f GiB", $2 / 1048576 }' /proc/meminfo) memory, $(uname -srm), $(java -version 2>&1 | head -n 1)"
  if [ -n "${TARE_JAVA_OPTS:-}" ]; then
    echo "jvm options: $TARE_JAVA_OPTS"
  fi
}

# bench_test_classpath: compiles the test sources and prints the class path that runs them (the test
# and main classes and every test-scoped dependency).
bench_test_classpath() {
  local target="$bench_repo/target"
  (cd "$bench_repo" && mvn -q -B test-compile \
    org.apache.maven.plugins:maven-dependency-plugin:3.9.0:build-classpath \
    -Dmdep.outputFile="$target/bench.classpath" -Dmdep.includeScope=test >&2)
  echo "$target/test-classes:$target/classes:$(cat "$target/bench.classpath")"
}

# Busy CPU time of the whole machine so far, in clock ticks: what other processes used during a run
# is this minus the run's own CPU time (a busy machine makes wall times meaningless).
bench_busy_ticks() {
  awk '/^cpu / { print $2 + $3 + $4 + $7 + $8 + $9 }' /proc/stat
}

# bench_time OK_CODES OUT COMMAND...: runs COMMAND under GNU time with its output in OUT and its errors
# in OUT.err, and sets bench_wall (seconds), bench_rss_mib (peak resident set, MiB), bench_cpu
# (user + system seconds) and bench_other_cpu (CPU seconds other processes used meanwhile). An exit
# code outside the space-separated OK_CODES shows the errors and stops the script.
bench_time() {
  local ok="$1" out="$2" report code before after
  shift 2
  report="$out.time"
  before="$(bench_busy_ticks)"
  set +e
  "$bench_timer" -v -o "$report" "$@" >"$out" 2>"$out.err"
  code=$?
  set -e
  after="$(bench_busy_ticks)"
  if ! [[ " $ok " == *" $code "* ]]; then
    tail -n 20 "$out.err" >&2
    echo "benchmark: '$*' exited with $code (see above)" >&2
    exit 1
  fi
  bench_wall="$(awk -F': ' '/Elapsed \(wall clock\)/ { n = split($2, p, ":"); s = 0; for (i = 1; i <= n; i++) s = s * 60 + p[i]; print s }' "$report")"
  bench_rss_mib="$(awk -F': ' '/Maximum resident set size/ { printf "%.0f", $2 / 1024 }' "$report")"
  bench_cpu="$(awk -F': ' '/User time|System time/ { s += $2 } END { printf "%.1f", s }' "$report")"
  bench_other_cpu="$(awk -v busy="$(( after - before ))" -v hz="$(getconf CLK_TCK)" -v cpu="$bench_cpu" \
    'BEGIN { other = busy / hz - cpu; printf "%.1f", other < 0 ? 0 : other }')"
}

# bench_median: the median of the numbers on standard input, one a line; "-" when there is none.
bench_median() {
  sort -g | awk '{ v[NR] = $1 } END { if (NR == 0) print "-"; else print (NR % 2) ? v[(NR + 1) / 2] : (v[NR / 2] + v[NR / 2 + 1]) / 2 }'
}
