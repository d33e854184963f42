package dev.tare.cli;

import dev.tare.TareException;
import dev.tare.report.CountReport;
import dev.tare.source.SafeReader;
import dev.tare.tokenize.Tokenizer;
import dev.tare.tokenize.TokenizerRegistry;
import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;
import picocli.CommandLine;

/** {@code tare count}: raw token counts of whole files. */
@Command(name = "count", mixinStandardHelpOptions = true, addMethodSubcommands = false,
        description = {"Counts the tokens of whole files exactly as the tokenizer sees them: no template parsing,"
                + " front matter included, a leading byte-order mark left out, special-token strings counted as text.",
                "A file that cannot be read is reported and the others are still counted; the exit code is then 2."})
final class CountCommand implements Callable<Integer> {
    /** The largest file count reads; larger files are refused. */
    static final long MAX_BYTES = 64L * 1024 * 1024;
    /** A thread keeps the char array it decoded into for the next file up to this size; a larger one is let go. */
    private static final int KEPT_BUFFER_CHARS = 1 << 20;

    enum Format { text, json }

    @Spec
    private CommandSpec spec;

    @Mixin
    private CommonOptions common;

    @Parameters(paramLabel = "FILE", arity = "1..*", description = "Files to count; - reads standard input;"
            + " @LIST counts every file LIST names, one path per line.")
    private List<String> files = new ArrayList<>();

    @Option(names = "--tokenizer", paramLabel = "NAME|PATH",
            description = "A built-in encoding (o200k_base, cl100k_base, p50k_base, r50k_base) or a tokenizer.json path. Default: " + TokenizerRegistry.DEFAULT + ".")
    private String tokenizer = TokenizerRegistry.DEFAULT;

    @Option(names = "--format", paramLabel = "FORMAT", description = "Output format: ${COMPLETION-CANDIDATES}. Default: ${DEFAULT-VALUE}.")
    private Format format = Format.text;

    @Override
    public Integer call() {
        Tokenizer counter = new TokenizerRegistry().get(tokenizer, Path.of("."));
        // Its vocabulary loads while the list is read and the first files are: every file needs it.
        TokenizerRegistry.prepare(List.of(counter));
        SafeReader reader = new SafeReader(MAX_BYTES);
        PrintWriter err = spec.commandLine().getErr();
        // Files are read and counted on every core; the report keeps the order they were named in.
        // Each thread decodes every file into one char array of its own, which the counter reads
        // where it lies: no String per file, nor a copy out of one.
        ThreadLocal<char[]> buffers = ThreadLocal.withInitial(() -> new char[8192]);
        List<FileCount> counted = named().parallelStream().map(name -> {
            try {
                SafeReader.Chars text = read(reader, name, buffers.get());
                if (text.array().length <= KEPT_BUFFER_CHARS) {
                    buffers.set(text.array());
                }
                return new FileCount(Optional.of(new CountReport.Entry(text.path(), counter.count(text.array(), text.length()),
                        text.length())), Optional.empty());
            } catch (TareException e) {
                return new FileCount(Optional.empty(), Optional.of("tare: " + name + ": " + e.getMessage()));
            }
        }).toList();
        List<CountReport.Entry> entries = new ArrayList<>();
        int failures = 0;
        for (FileCount one : counted) {
            one.entry().ifPresent(entries::add);
            if (one.error().isPresent()) {
                err.println(one.error().get());
                failures++;
            }
        }
        String report = format == Format.json ? CountReport.json(counter.name(), entries) : CountReport.text(counter.name(), entries);
        spec.commandLine().getOut().print(report);
        spec.commandLine().getOut().flush();
        err.flush();
        return failures == 0 ? ExitCodes.OK : ExitCodes.USAGE;
    }

    /**
     * The files named: each FILE, and for {@code @LIST} every line of LIST (blank lines and a line's
     * carriage return left out). Tare reads lists itself rather than letting the command-line parser
     * expand them: the parser costs about 15 microseconds an argument, a quarter of a second for a
     * list of 20,000 files, and wants paths with spaces quoted.
     */
    private List<String> named() {
        List<String> named = new ArrayList<>();
        for (String name : files) {
            if (name.length() < 2 || name.charAt(0) != '@') {
                named.add(name);
                continue;
            }
            Path list = Path.of(name.substring(1));
            try {
                for (String line : Files.readAllLines(list, java.nio.charset.StandardCharsets.UTF_8)) {
                    String path = line.endsWith("\r") ? line.substring(0, line.length() - 1) : line;
                    if (!path.isBlank()) {
                        named.add(path);
                    }
                }
            } catch (IOException | java.io.UncheckedIOException e) {
                throw new CommandLine.ParameterException(spec.commandLine(), list + ": the list of files cannot be read ("
                        + e.getClass().getSimpleName() + "); name a text file with one path per line");
            }
        }
        return named;
    }

    /** One named file: its count, or the one-line error that says why it has none. */
    private record FileCount(Optional<CountReport.Entry> entry, Optional<String> error) {
    }

    private static SafeReader.Chars read(SafeReader reader, String name, char[] buffer) {
        if (name.equals("-")) {
            try {
                return reader.decodeChars("-", System.in.readNBytes((int) MAX_BYTES + 1), buffer);
            } catch (IOException e) {
                throw new TareException("standard input cannot be read (" + e.getMessage() + ")", e);
            }
        }
        Path file = Path.of(name);
        try {
            return reader.readChars(file.normalize().toString().replace('\\', '/'), file, buffer);
        } catch (TareException e) {
            // Asked only now: two more system calls for every file counted were a few percent of a count.
            if (Files.isDirectory(file)) {
                throw new TareException("is a folder; count takes files (use 'tare scan' for a folder of templates)");
            }
            if (!Files.exists(file)) {
                throw new TareException("no such file");
            }
            throw e;
        }
    }
}
