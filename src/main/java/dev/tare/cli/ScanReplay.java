package dev.tare.cli;

import dev.tare.Tare;
import dev.tare.scan.RememberedLines;
import dev.tare.scan.TemplateScan;
import dev.tare.tokenize.TokenizerRegistry;
import java.io.PrintWriter;
import java.nio.ByteBuffer;
import java.nio.file.Files;
import java.nio.file.InvalidPathException;
import java.nio.file.Path;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.OptionalInt;
import java.util.Set;
import java.util.TreeSet;

/**
 * Prints a warm {@code tare scan} without building its command line. Building picocli's model of
 * the command and parsing the arguments is about 60 ms of a 200 ms warm scan (DEVELOPERS.md), and
 * one build of Tare parses a command line the same way each time it is run in the same folder, with
 * the same locale and picocli settings. So what a scan's command line asked for ({@link ScanRequest})
 * is remembered under that key ({@link RememberedLines}) in the cache of the root it scanned, when
 * that root is where the next run looks: the working folder, or a folder the command line names.
 *
 * <p>Everything after the parsing runs as in any warm scan: {@code tare.yaml} is read, the cache
 * key made and every stamp of the stored report checked. When nothing was remembered, the report
 * no longer holds or anything fails, nothing has been printed and the command line is parsed and
 * run as usual. Only scans whose report is stored take part, and none with {@code --timings} or
 * {@code --debug}, which print more than the report.
 */
final class ScanReplay {
    /** The kind of remembered lines, and the start of their files' names in the cache. */
    static final String KIND = "args-scan";

    private ScanReplay() {
    }

    /** The exit code of {@code args} run from what was remembered, or empty when they must be parsed and run. */
    static OptionalInt run(String[] args, PrintWriter out) {
        if (args.length == 0 || !args[0].equals("scan")) {
            return OptionalInt.empty();
        }
        try {
            String key = key(args);
            for (Path place : places(args)) {
                Optional<ScanRequest> request = RememberedLines.read(place, KIND, key).flatMap(ScanRequest::of);
                if (request.isPresent()) {
                    return print(request.get(), out);
                }
            }
        } catch (RuntimeException e) {
            // A folder gone, a configuration now broken: the usual run says what is wrong, properly.
        }
        return OptionalInt.empty();
    }

    /** Remembers what {@code args} asked for, when the next run of them will look in {@code root}. */
    static void remember(String[] args, ScanRequest request, Path root) {
        if (request.stored() && places(args).contains(root)) {
            RememberedLines.write(root, KIND, key(args), request.lines());
        }
    }

    /** Prints the report stored for {@code request} when it still holds (only a stored request is remembered). */
    private static OptionalInt print(ScanRequest request, PrintWriter out) {
        Optional<ByteBuffer> report = new TemplateScan(request.workspace(), new TokenizerRegistry())
                .storedReport(request.options(), request.form());
        if (report.isEmpty()) {
            return OptionalInt.empty();
        }
        StandardOutput.print(out, report.get());
        return OptionalInt.of(ExitCodes.OK);
    }

    /**
     * Everything that decides how {@code args} parse: the build, the working folder, the default
     * locale, picocli's settings (system properties named {@code picocli.*}, but for the converter
     * exclusion {@link TareCommand} itself sets when none is given) and the arguments.
     */
    private static String key(String[] args) {
        StringBuilder key = new StringBuilder(Tare.buildIdentity()).append('\n')
                .append(Path.of("").toAbsolutePath().normalize()).append('\n')
                .append(Locale.getDefault().toLanguageTag()).append('\n');
        for (String name : new TreeSet<>(System.getProperties().stringPropertyNames())) {
            String value = System.getProperty(name);
            boolean tareDefault = name.equals(TareCommand.CONVERTER_EXCLUDES)
                    && TareCommand.UNUSED_CONVERTERS.equals(value);
            if (name.startsWith("picocli.") && !tareDefault) {
                key.append(name).append('=').append(value).append('\n');
            }
        }
        for (String arg : args) {
            key.append('\0').append(arg);
        }
        return key.toString();
    }

    /** Where a run of {@code args} looks for what was remembered: the working folder, then each folder they name. */
    private static List<Path> places(String[] args) {
        Set<Path> places = new LinkedHashSet<>();
        places.add(Path.of("").toAbsolutePath().normalize());
        for (int i = 1; i < args.length; i++) {
            if (args[i].startsWith("-")) {
                continue;
            }
            try {
                Path path = Path.of(args[i]).toAbsolutePath().normalize();
                if (Files.isDirectory(path)) {
                    places.add(path);
                }
            } catch (InvalidPathException e) {
                // Not a path: an option's value.
            }
        }
        return List.copyOf(places);
    }
}
