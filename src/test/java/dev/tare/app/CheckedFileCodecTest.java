package dev.tare.app;

import dev.tare.lint.Edit;
import dev.tare.lint.Finding;
import dev.tare.lint.Related;
import dev.tare.lint.Rewrite;
import dev.tare.lint.RewriteClass;
import dev.tare.lint.Severity;
import dev.tare.lint.Suppressions;
import static org.junit.jupiter.api.Assertions.assertEquals;

import java.io.ByteArrayInputStream;
import java.io.ByteArrayOutputStream;
import java.io.DataInputStream;
import java.io.DataOutputStream;
import java.io.IOException;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Random;
import java.util.Set;
import org.junit.jupiter.api.Test;

/**
 * What the check's cache writes for a file reads back as the same findings, directives and hash:
 * on random files, with texts past the 64 KiB that Java's modified UTF-8 stops at, characters
 * outside the basic plane, findings placed in other files, and the whole-run result, whose findings
 * have no file of their own.
 */
class CheckedFileCodecTest {
    private final CheckedFileCodec codec = new CheckedFileCodec();

    @Test
    void randomFilesReadBackAsWritten() throws IOException {
        Random random = new Random(17);
        for (int i = 0; i < 500; i++) {
            CheckedFile written = randomFile(random, i % 50 == 0);
            CheckedFile read = roundTrip(written, i % 7 == 0 ? "" : "prompts/own.md");
            assertEquals(written.findings(), read.findings());
            assertEquals(written.hash(), read.hash());
            assertEquals(written.suppressions().isPresent(), read.suppressions().isPresent());
            if (written.suppressions().isPresent()) {
                Suppressions was = written.suppressions().get();
                Suppressions is = read.suppressions().get();
                assertEquals(was.directives(), is.directives());
                assertEquals(was.fileWide(), is.fileWide());
                assertEquals(was.byLine(), is.byLine());
            }
        }
    }

    @Test
    void anEmptyFileReadsBackEmpty() throws IOException {
        CheckedFile empty = new CheckedFile(List.of(), Optional.empty(), Optional.empty());
        assertEquals(empty, roundTrip(empty, "prompts/own.md"));
    }

    private CheckedFile roundTrip(CheckedFile file, String path) throws IOException {
        ByteArrayOutputStream bytes = new ByteArrayOutputStream();
        try (DataOutputStream out = new DataOutputStream(bytes)) {
            codec.write(out, file);
            out.writeInt(0x5eed); // what follows an entry must still be where the reader stops
        }
        DataInputStream in = new DataInputStream(new ByteArrayInputStream(bytes.toByteArray()));
        CheckedFile read = codec.read(in, path);
        assertEquals(0x5eed, in.readInt(), "the reader stopped at the end of the entry");
        return read;
    }

    private static CheckedFile randomFile(Random random, boolean huge) {
        List<Finding> findings = new ArrayList<>();
        String own = "prompts/" + text(random, 8) + ".md";
        for (int f = random.nextInt(6); f > 0; f--) {
            String path = random.nextInt(5) == 0 ? "prompts/other-" + text(random, 4) + ".md" : own;
            Optional<Rewrite> rewrite = Optional.empty();
            if (random.nextBoolean()) {
                List<Edit> edits = new ArrayList<>();
                int at = 0;
                for (int e = random.nextInt(4); e > 0; e--) {
                    int start = at + random.nextInt(20);
                    int end = start + random.nextInt(10);
                    edits.add(new Edit(start, end, huge ? text(random, 70_000) : text(random, random.nextInt(30))));
                    at = end;
                }
                rewrite = Optional.of(new Rewrite(edits, random.nextInt(200) - 50));
            }
            List<Related> related = new ArrayList<>();
            for (int r = random.nextInt(3); r > 0; r--) {
                related.add(new Related("prompts/" + text(random, 6), 1 + random.nextInt(99), 1 + random.nextInt(80),
                        text(random, 20)));
            }
            Severity[] severities = Severity.values();
            RewriteClass[] classes = RewriteClass.values();
            findings.add(new Finding(path, 1 + random.nextInt(500), 1 + random.nextInt(120), 1 + random.nextInt(500),
                    1 + random.nextInt(120), "rule-" + random.nextInt(30), severities[random.nextInt(severities.length)],
                    text(random, 40), classes[random.nextInt(classes.length)], rewrite, related));
        }
        Optional<Suppressions> suppressions = Optional.empty();
        if (random.nextBoolean()) {
            suppressions = Optional.of(Suppressions.restored(
                    List.of(new Suppressions.Directive(random.nextInt(900), List.of("space-run", "all"))),
                    Set.of("blank-lines"), Map.of(1 + random.nextInt(40), Set.of("space-run"), 50, Set.of("all"))));
        }
        Optional<Integer> hash = random.nextBoolean() ? Optional.of(random.nextInt()) : Optional.empty();
        return new CheckedFile(findings, suppressions, hash);
    }

    /** Letters, spaces, accented letters, CJK and characters outside the basic plane (surrogate pairs). */
    private static String text(Random random, int length) {
        String[] pieces = {"a", "Z", " ", "é", "ß", "水", "\uD83D\uDE00", "\n", "\"", "{{"};
        StringBuilder out = new StringBuilder();
        for (int i = 0; i < length; i++) {
            out.append(pieces[random.nextInt(pieces.length)]);
        }
        return out.toString();
    }
}
