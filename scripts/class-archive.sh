#!/usr/bin/env bash
# Writes the class-data archive that lets Tare's JVM start faster, for the JDK that runs the build.
# Maven runs it after packaging: scripts/class-archive.sh JAVA_HOME JAR PROJECT_DIR.
#
# A training run does what the pre-commit hook does (`tare hook run` on a copy of the demo
# repository with its templates staged), then, for a static archive, a scan twice (cold, then warm
# from the cache the first left), and records the classes Tare loads; the archive then holds them
# already parsed and verified, so later runs skip that work:
#   JDK 17 to 23: a static class-data-sharing archive, tare.jsa beside the jar;
#   JDK 24 and newer: an ahead-of-time cache, tare.aot beside the jar (classes also linked).
# An archive fits one JDK build and one jar file. Beside it, tare.jsa.jdk (or tare.aot.jdk) names
# the JDK that made it as "HOME VERSION" (the JDK's real path and its release file's
# JAVA_RUNTIME_VERSION); ./tare passes the archive only to that JDK, and so does the pre-commit hook
# it installs, which runs Tare through it.
#
# The archive only saves time, so nothing here fails the build: when a step fails, it says so in
# one line on standard error and leaves no archive. TARE_CLASS_ARCHIVE=off skips it.
set -uo pipefail

java_home="$1"
jar="$2"
project="$3"
out="$(dirname "$jar")"

note() {
  echo "class-archive: $*; Tare runs without a class-data archive (slower start)" >&2
}

rm -f "$out/tare.jsa" "$out/tare.jsa.jdk" "$out/tare.aot" "$out/tare.aot.jdk"
if [ "${TARE_CLASS_ARCHIVE:-on}" = off ]; then
  exit 0
fi

java="$java_home/bin/java"
home="$(cd "$java_home" 2>/dev/null && pwd -P)" || { note "no JDK at $java_home"; exit 0; }
version="$(sed -n 's/^JAVA_RUNTIME_VERSION="\(.*\)"$/\1/p' "$home/release" 2>/dev/null)"
[ -n "$version" ] || { note "$home/release does not name the JDK's version"; exit 0; }
feature="${version%%[.+-]*}"
case "$feature" in
  '' | *[!0-9]*) note "cannot read the JDK's version from '$version'"; exit 0 ;;
esac
if [ "$feature" -ge 24 ]; then
  kind=aot
else
  kind=jsa
fi

work="$(mktemp -d "${TMPDIR:-/tmp}/tare-class-archive.XXXXXX")" || { note "no temporary folder"; exit 0; }
trap 'rm -rf "$work"' EXIT

# The training repository: the demo with its configuration, partials, rule packs, tokenizer file and
# tool files committed, and its templates staged, as in a commit that changes prompts.
repo="$work/repo"
mkdir -p "$repo"
cp -R "$project/corpora/demo/." "$repo/" || { note "cannot copy corpora/demo"; exit 0; }
training=(hook run)
git_in_repo() {
  git -C "$repo" -c user.name=tare -c user.email=tare@example.invalid -c commit.gpgsign=false \
    -c core.hooksPath=/dev/null "$@" >>"$work/git.log" 2>&1
}
if ! { git_in_repo init -q && git_in_repo add -A && git_in_repo rm -q -r --cached prompts \
    && git_in_repo commit -q --no-verify -m base && git_in_repo add -A; }; then
  # Without git the hook's path cannot run; the check over the same files loads nearly the same classes.
  training=(check .)
fi

# Every JVM here starts as the launcher starts Tare: the main class named and, from JDK 22 on, native
# access enabled on the command line. A JDK 25 cache made without that option is refused by a JVM
# started with it ("Mismatched values for property jdk.module.enable.native.access").
start=(-cp "$jar" dev.tare.cli.Main)
native=()
if [ "$feature" -ge 22 ]; then native=(--enable-native-access=ALL-UNNAMED); fi

record() {
  (cd "$repo" && "$java" "$@" ${native[@]+"${native[@]}"} "${start[@]}" "${training[@]}") >"$work/training.log" 2>&1
  # Exit code 1 is expected: the demo's templates carry planted findings. 2 or more is a failure.
  [ $? -le 1 ]
}

# A static archive (JDK 17 to 23) can hold the classes of several runs: besides the hook's, those of a
# scan run twice, the other command people repeat: the first measures every template, the second
# reads the measurements back from .tare/cache. The files are dated back first, so that the second
# scan finds them old enough for their size and time to vouch for them. Should the scans fail, the
# archive holds the hook's classes alone. An ahead-of-time cache (JDK 24 on) records one run: the hook's.
add_repeated_scan() {
  find "$repo" -exec touch -t 202601010000 {} + || return 0
  for run in 1 2; do
    (cd "$repo" && "$java" -XX:DumpLoadedClassList="$work/scan$run.lst" ${native[@]+"${native[@]}"} "${start[@]}" \
      scan . --format json) \
      >>"$work/training.log" 2>&1 || return 0
  done
  # Each class once, in the order first loaded.
  awk '!seen[$0]++' "$work/classes.lst" "$work/scan1.lst" "$work/scan2.lst" >"$work/joined.lst" \
    && mv "$work/joined.lst" "$work/classes.lst"
  return 0
}

if [ "$kind" = aot ]; then
  record -XX:AOTMode=record -XX:AOTConfiguration="$work/tare.aotconf" \
    && "$java" ${native[@]+"${native[@]}"} -XX:AOTMode=create -XX:AOTConfiguration="$work/tare.aotconf" \
      -XX:AOTCache="$work/tare.aot" -cp "$jar" >"$work/dump.log" 2>&1
else
  record -XX:DumpLoadedClassList="$work/classes.lst" \
    && { add_repeated_scan; "$java" ${native[@]+"${native[@]}"} -Xshare:dump \
      -XX:SharedClassListFile="$work/classes.lst" -XX:SharedArchiveFile="$work/tare.jsa" -cp "$jar" \
      >"$work/dump.log" 2>&1; }
fi
status=$?
if [ "$status" -ne 0 ] || [ ! -s "$work/tare.$kind" ]; then
  tail -n 5 "$work/training.log" "$work/dump.log" >&2 2>/dev/null
  note "making $out/tare.$kind with $java failed"
  exit 0
fi

# The archive first, its JDK stamp last: a reader that sees the stamp sees the whole archive.
mv "$work/tare.$kind" "$out/tare.$kind" && printf '%s %s\n' "$home" "$version" >"$out/tare.$kind.jdk" \
  || note "cannot write $out/tare.$kind"
exit 0
