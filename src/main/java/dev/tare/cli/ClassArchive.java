package dev.tare.cli;

import java.util.List;

/**
 * What {@code --timings} says about the class-data archive the build leaves beside the jar
 * ({@code scripts/class-archive.sh}): {@code tare.aot} (an ahead-of-time cache, JDK 24 and newer)
 * or {@code tare.jsa} (a class-data-sharing archive, JDK 17 to 23). The {@code ./tare} launcher
 * alone decides whether a run is given one.
 */
final class ClassArchive {
    /** How the JVM reports that it runs with class-data sharing on ({@code java.vm.info}). */
    private static final String SHARING = "sharing";

    private ClassArchive() {
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
