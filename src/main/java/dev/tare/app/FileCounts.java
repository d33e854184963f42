package dev.tare.app;

import dev.tare.TareException;
import dev.tare.source.SafeReader;
import dev.tare.tokenize.Tokenizer;
import dev.tare.tokenize.TokenizerRegistry;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;

/**
 * The tokens of whole files exactly as a tokenizer sees them: no template parsing, front matter
 * included, a leading byte-order mark left out, special-token strings counted as text. A file that
 * cannot be read is reported and the others are still counted.
 */
public final class FileCounts {
    /** The largest file counted; larger files are refused. */
    public static final long MAX_BYTES = 64L * 1024 * 1024;
    /** A thread keeps the char array it decoded into for the next file up to this size; a larger one is let go. */
    private static final int KEPT_BUFFER_CHARS = 1 << 20;

    private FileCounts() {
    }

    /**
     * One file's count.
     *
     * @param path   the file as named, with {@code /}
     * @param tokens its tokens
     * @param chars  its UTF-16 characters
     */
    public record FileTokens(String path, int tokens, int chars) {
    }

    /**
     * What counting gave: the counts of the files that could be read, in the order named, and one
     * message per file that could not ({@code NAME: why}).
     */
    public record Tally(List<FileTokens> files, List<String> errors) {
        public Tally {
            files = List.copyOf(files);
            errors = List.copyOf(errors);
        }
    }

    /**
     * Counts every file named ({@code -} reads standard input) with {@code counter}, on every core.
     */
    public static Tally count(List<String> names, Tokenizer counter) {
        // Its vocabulary loads while the first files are read: every file needs it.
        TokenizerRegistry.prepare(List.of(counter));
        SafeReader reader = new SafeReader(MAX_BYTES);
        // Each thread decodes every file into one char array of its own, which the counter reads where
        // it lies: no String per file, nor a copy out of one.
        ThreadLocal<char[]> buffers = ThreadLocal.withInitial(() -> new char[8192]);
        List<Attempt> attempts = names.parallelStream().map(name -> {
            try {
                SafeReader.Chars text = read(reader, name, buffers.get());
                if (text.array().length <= KEPT_BUFFER_CHARS) {
                    buffers.set(text.array());
                }
                return new Attempt(Optional.of(new FileTokens(text.path(), counter.count(text.array(), text.length()),
                        text.length())), Optional.empty());
            } catch (TareException e) {
                return new Attempt(Optional.empty(), Optional.of(name + ": " + e.getMessage()));
            }
        }).toList();
        List<FileTokens> files = new ArrayList<>();
        List<String> errors = new ArrayList<>();
        for (Attempt attempt : attempts) {
            attempt.file().ifPresent(files::add);
            attempt.error().ifPresent(errors::add);
        }
        return new Tally(files, errors);
    }

    /**
     * The files named: each argument, and for {@code @LIST} every line of LIST (blank lines and a
     * line's carriage return left out). Lists are read here rather than by the command-line parser,
     * which wants paths with spaces quoted and costs time per argument on long lists.
     *
     * @throws TareException naming a list that cannot be read
     */
    public static List<String> named(List<String> arguments) {
        List<String> named = new ArrayList<>();
        for (String argument : arguments) {
            if (argument.length() < 2 || argument.charAt(0) != '@') {
                named.add(argument);
                continue;
            }
            Path list = Path.of(argument.substring(1));
            try {
                for (String line : Files.readAllLines(list, StandardCharsets.UTF_8)) {
                    String path = line.endsWith("\r") ? line.substring(0, line.length() - 1) : line;
                    if (!path.isBlank()) {
                        named.add(path);
                    }
                }
            } catch (NoSuchFileException e) {
                throw new TareException(list + ": no such list of files; name a text file with one path per line");
            } catch (IOException | UncheckedIOException e) {
                throw new TareException(list + ": the list of files cannot be read (" + e.getMessage()
                        + "); name a UTF-8 text file with one path per line");
            }
        }
        return named;
    }

    /** One named file: its count, or the message that says why it has none. */
    private record Attempt(Optional<FileTokens> file, Optional<String> error) {
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
            // Asked only after a failure, so that a file counted costs no extra system calls.
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
