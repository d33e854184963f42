package dev.tare.app;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.util.List;
import java.util.stream.Stream;

/**
 * A build step, not part of Tare's commands: lists the built-in rule packs copied into the class output
 * folder in {@value #INDEX}, one file name a line, so that reading them from the jar needs no listing
 * of the jar. Maven runs it after compiling ({@code process-classes}).
 */
public final class PackIndex {
    /** The index's resource name. */
    static final String INDEX = RulePacks.FOLDER + "/index.txt";

    private PackIndex() {
    }

    /** Writes the index of {@code args[0]}/rules, the class output folder's packs. */
    public static void main(String[] args) throws IOException {
        if (args.length != 1) {
            throw new IllegalArgumentException("usage: PackIndex CLASS_OUTPUT_FOLDER");
        }
        Path folder = Path.of(args[0], RulePacks.FOLDER);
        Files.createDirectories(folder);
        Path partial = folder.resolve("index.txt.partial");
        Files.write(partial, names(folder), StandardCharsets.UTF_8);
        Files.move(partial, folder.resolve("index.txt"), StandardCopyOption.REPLACE_EXISTING, StandardCopyOption.ATOMIC_MOVE);
    }

    /** The pack files in {@code folder}, in name order. */
    static List<String> names(Path folder) throws IOException {
        try (Stream<Path> list = Files.list(folder)) {
            return list.map(p -> p.getFileName().toString()).filter(PackIndex::isPack).sorted().toList();
        }
    }

    static boolean isPack(String fileName) {
        return fileName.endsWith(".yaml") || fileName.endsWith(".yml");
    }
}
