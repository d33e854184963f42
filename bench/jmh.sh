#!/usr/bin/env bash
# Runs the JMH benchmarks in src/test/java/dev/tare/bench: compiles the test sources (JMH's
# annotation processor generates the harness there), writes the test class path, and starts JMH's
# runner with every argument passed through. No argument runs every benchmark with the settings in
# its annotations; for example
#
#   bash bench/jmh.sh RuleEngineBenchmark -wi 1 -i 3     # the rule engine, fewer iterations
#   bash bench/jmh.sh TokenizerBenchmark -p encoding=o200k_base
#   bash bench/jmh.sh -h                                  # JMH's own options
#
# Environment: JAVA_HOME (build and run with that JDK).
set -euo pipefail

here="$(cd "$(dirname "${BASH_SOURCE[0]}")" && pwd)"
repo="$(cd "$here/.." && pwd)"
target="$repo/target"

if [ -n "${JAVA_HOME:-}" ]; then
  export PATH="$JAVA_HOME/bin:$PATH"
fi
command -v mvn >/dev/null 2>&1 || { echo "jmh.sh: Maven (mvn) is needed; install it and try again" >&2; exit 2; }
command -v java >/dev/null 2>&1 || { echo "jmh.sh: java is not on PATH; install a JDK 17+ or set JAVA_HOME" >&2; exit 2; }

cd "$repo"
mvn -q -B test-compile \
  org.apache.maven.plugins:maven-dependency-plugin:3.9.0:build-classpath \
  -Dmdep.outputFile="$target/bench.classpath" -Dmdep.includeScope=test >&2

exec java -cp "$target/test-classes:$target/classes:$(cat "$target/bench.classpath")" org.openjdk.jmh.Main "$@"
