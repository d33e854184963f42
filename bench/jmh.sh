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

source "$(dirname "${BASH_SOURCE[0]}")/common.sh"
bench_require jmh.sh
command -v mvn >/dev/null 2>&1 || { echo "jmh.sh: Maven (mvn) is needed; install it and try again" >&2; exit 2; }
classpath="$(bench_test_classpath)"
exec java -cp "$classpath" org.openjdk.jmh.Main "$@"
