package dev.tare.workspace;

import dev.tare.TareException;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.InputStream;
import java.io.OutputStream;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;

/**
 * Runs the {@code git} command line in one folder and hands back what it wrote. Git's own environment
 * is inherited, so inside a hook the index git names ({@code GIT_INDEX_FILE}, a temporary one for
 * {@code git commit -a} or {@code git commit PATH}) is the one read and written. Pathspecs are literal.
 */
final class GitCommand {
    private final Path folder;

    GitCommand(Path folder) {
        this.folder = folder;
    }

    /** The folder commands run in. */
    Path folder() {
        return folder;
    }

    /**
     * Runs {@code git ARGS} with {@code input} on its standard input and returns its standard output.
     *
     * @throws Failed when git exits with a non-zero code (its first line of standard error says why)
     * @throws TareException when git cannot be started
     */
    byte[] run(byte[] input, String... args) {
        List<String> command = new ArrayList<>(List.of("git", "--literal-pathspecs", "-c", "core.quotePath=false"));
        command.addAll(List.of(args));
        Process process;
        try {
            ProcessBuilder builder = new ProcessBuilder(command).directory(folder.toFile());
            absolutePaths(builder.environment(), Path.of("").toAbsolutePath());
            process = builder.start();
        } catch (IOException e) {
            throw new TareException("the git command cannot be started (" + e.getMessage() + "); install git or put it on PATH", e);
        }
        // Input is written on its own thread: git may fill its output pipe before it has read all of it.
        Thread feeder = new Thread(() -> feed(process.getOutputStream(), input), "git-input");
        feeder.setDaemon(true);
        feeder.start();
        ByteArrayOutputStream errors = new ByteArrayOutputStream();
        Thread drain = new Thread(() -> copy(process.getErrorStream(), errors), "git-errors");
        drain.setDaemon(true);
        drain.start();
        try {
            byte[] output = process.getInputStream().readAllBytes();
            int code = process.waitFor();
            drain.join();
            feeder.join();
            if (code != 0) {
                throw new Failed(firstLine(errors.toString(StandardCharsets.UTF_8)));
            }
            return output;
        } catch (IOException e) {
            throw new UncheckedIOException("reading the output of " + String.join(" ", command), e);
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            process.destroy();
            throw new TareException("interrupted while git ran", e);
        }
    }

    /** The variables git exports to a hook that name paths, which it may give relative to the hook's folder. */
    private static final List<String> PATH_VARIABLES = List.of("GIT_INDEX_FILE", "GIT_DIR", "GIT_WORK_TREE",
            "GIT_COMMON_DIR", "GIT_OBJECT_DIRECTORY");

    /**
     * Makes the paths git named in {@code environment} absolute against {@code here}, the folder Tare was
     * started in: git runs a pre-commit hook with {@code GIT_INDEX_FILE=.git/index}, meant for the
     * hook's own folder, which would name another file for a command started in a subfolder.
     */
    static void absolutePaths(Map<String, String> environment, Path here) {
        for (String name : PATH_VARIABLES) {
            String value = environment.get(name);
            if (value != null && !value.isEmpty() && !Path.of(value).isAbsolute()) {
                environment.put(name, here.resolve(value).normalize().toString());
            }
        }
    }

    private static void feed(OutputStream stdin, byte[] input) {
        try (stdin) {
            stdin.write(input);
        } catch (IOException e) {
            // git stopped reading: its exit code and standard error say why.
        }
    }

    private static void copy(InputStream from, ByteArrayOutputStream to) {
        try (from) {
            from.transferTo(to);
        } catch (IOException e) {
            // The exit code still says whether git failed.
        }
    }

    private static String firstLine(String text) {
        String line = text.strip().lines().findFirst().orElse("");
        return line.isEmpty() ? "git failed without a message" : line;
    }

    /** Git ran and exited with a non-zero code. */
    static final class Failed extends RuntimeException {
        private static final long serialVersionUID = 1L;

        Failed(String message) {
            super(message);
        }
    }
}
