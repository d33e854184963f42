package dev.tare.tokenize;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;

/**
 * A build step, not part of Tare's commands: writes the compact form of every built-in encoding's
 * vocabulary into the class output folder, where {@link Vocabulary#load} finds it. Maven runs it after
 * compiling ({@code process-classes}); {@code VocabularyTest} checks that each compact form holds
 * exactly the tokens and ranks of jtokkit's file.
 */
public final class CompactVocabularies {
    private CompactVocabularies() {
    }

    /** Writes the compact forms under {@code args[0]}, the class output folder. */
    public static void main(String[] args) throws IOException {
        if (args.length != 1) {
            throw new IllegalArgumentException("usage: CompactVocabularies CLASS_OUTPUT_FOLDER");
        }
        Path classes = Path.of(args[0]);
        for (String encoding : TokenizerRegistry.BUILT_IN) {
            Path target = classes.resolve(String.format(Vocabulary.COMPACT, encoding).substring(1));
            Files.createDirectories(target.getParent());
            Path partial = target.resolveSibling(target.getFileName() + ".partial");
            Files.write(partial, Vocabulary.fromTiktoken(encoding).compact());
            Files.move(partial, target, StandardCopyOption.REPLACE_EXISTING, StandardCopyOption.ATOMIC_MOVE);
        }
    }
}
