package dev.tare.cli;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Optional;

/**
 * The class-data archive the build leaves beside the jar ({@code scripts/class-archive.sh}), which
 * lets the JVM skip parsing and verifying Tare's classes: {@code tare.aot} (an ahead-of-time cache,
 * JDK 24 and newer) or {@code tare.jsa} (a class-data-sharing archive, JDK 17 to 23), each with a
 * {@code .jdk} stamp naming the JDK that made it. This is the choice the {@code ./tare} launcher
 * makes, for the pre-commit hook, which runs {@code java} directly; keep the two in step.
 */
final class ClassArchive {
    /** How the JVM reports that it runs with class-data sharing on ({@code java.vm.info}). */
    private static final String SHARING = "sharing";

    private ClassArchive() {
    }

    /**
     * The JVM options that use the archive beside {@code jar} on the JDK at {@code javaHome}; empty
     * when there is none, or when another JDK made it. The options also switch off the JVM's
     * class-data logging: should the archive not fit after all (the JDK was updated in place, the jar
     * rebuilt), the JVM runs without it and would otherwise say so on standard output.
     */
    static List<String> options(Path javaHome, Path jar) {
        Optional<String> identity = identity(javaHome);
        if (identity.isEmpty()) {
            return List.of();
        }
        Path folder = jar.toAbsolutePath().getParent();
        Path aot = folder.resolve("tare.aot");
        if (madeBy(aot, identity.get())) {
            return List.of("-XX:AOTCache=" + aot, "-Xlog:aot*=off,cds*=off");
        }
        Path jsa = folder.resolve("tare.jsa");
        if (madeBy(jsa, identity.get())) {
            return List.of("-XX:SharedArchiveFile=" + jsa, "-Xshare:auto", "-Xlog:cds*=off");
        }
        return List.of();
    }

    /**
     * The JDK at {@code javaHome} as the stamps name it: its real path and its release file's
     * {@code JAVA_RUNTIME_VERSION}, the same words the launcher reads without starting a JVM.
     */
    static Optional<String> identity(Path javaHome) {
        try {
            Path home = javaHome.toRealPath();
            for (String line : Files.readAllLines(home.resolve("release"), StandardCharsets.UTF_8)) {
                if (line.startsWith("JAVA_RUNTIME_VERSION=")) {
                    String version = line.substring(line.indexOf('=') + 1).replace("\"", "");
                    return version.isEmpty() ? Optional.empty() : Optional.of(home + " " + version);
                }
            }
            return Optional.empty();
        } catch (IOException e) {
            return Optional.empty();
        }
    }

    private static boolean madeBy(Path archive, String identity) {
        Path stamp = archive.resolveSibling(archive.getFileName() + ".jdk");
        try {
            return Files.isRegularFile(archive) && Files.readString(stamp, StandardCharsets.UTF_8).strip().equals(identity);
        } catch (IOException e) {
            return false;
        }
    }

    /**
     * What this JVM does with an archive, for {@code --timings}: in use, given but not used (it did not
     * fit this JDK or this jar), or none given.
     */
    static String status(List<String> jvmArguments, String vmInfo) {
        boolean given = jvmArguments.stream().anyMatch(a -> a.startsWith("-XX:SharedArchiveFile=") || a.startsWith("-XX:AOTCache="));
        if (!given) {
            return "none";
        }
        return vmInfo.contains(SHARING) ? "in use" : "not used (made by another JDK build or for another jar)";
    }
}
