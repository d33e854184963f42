package dev.tare.cli;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import dev.tare.tokenize.Tokenizer;
import dev.tare.tokenize.TokenizerRegistry;
import dev.tare.workspace.FileSystemOps;
import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.attribute.FileTime;
import java.nio.file.attribute.PosixFilePermission;
import java.nio.file.attribute.PosixFilePermissions;
import java.util.List;
import java.util.Set;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import picocli.CommandLine;

/**
 * {@code tare fix} on small repositories: exact bytes out for CRLF, BOM and executable files; writes
 * that fail at each step leave the original and no temporary file; a file changed meanwhile, a
 * read-only file and a link are handled as a careful user expects; exit codes per design.md and the
 * command's help (0 ok, 1 a file not fixed, 2 usage). Byte-order mark: Unicode 15.0 §23.8, U+FEFF as
 * the UTF-8 bytes EF BB BF (RFC 3629 §6).
 */
class FixCommandTest {
    private static final String CONFIG = "templates:\n  include: [\"prompts/**/*.md\"]\n  partials: prompts/partials\n";

    @TempDir
    Path dir;

    private Path write(String path, byte[] bytes) throws IOException {
        Path file = dir.resolve(path);
        Files.createDirectories(file.getParent());
        return Files.write(file, bytes);
    }

    private Path write(String path, String text) throws IOException {
        return write(path, text.getBytes(StandardCharsets.UTF_8));
    }

    private Path repo() throws IOException {
        Files.writeString(dir.resolve("tare.yaml"), CONFIG);
        return dir;
    }

    /** Runs {@code tare ARGS} with writes going through {@code files}. */
    private static Cli.Run runWith(FileSystemOps files, String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        CommandLine commandLine = TareCommand.commandLine(new PrintWriter(out, true), new PrintWriter(err, true));
        ((FixCommand) commandLine.getSubcommands().get("fix").getCommand()).fileSystem = files;
        int code = commandLine.execute(args);
        return new Cli.Run(code, out.toString(), err.toString());
    }

    private List<String> folder(Path folder) throws IOException {
        try (Stream<Path> files = Files.list(folder)) {
            return files.map(p -> p.getFileName().toString()).sorted().toList();
        }
    }

    private static byte[] bom(String text) {
        byte[] body = text.getBytes(StandardCharsets.UTF_8);
        byte[] bytes = new byte[body.length + 3];
        bytes[0] = (byte) 0xEF;
        bytes[1] = (byte) 0xBB;
        bytes[2] = (byte) 0xBF;
        System.arraycopy(body, 0, bytes, 3, body.length);
        return bytes;
    }

    @Test
    void crlfBomAndExecutableFilesRoundTripWithOnlyTheIntendedEdits() throws IOException {
        repo();
        Path crlf = write("prompts/crlf.md", bom("Hello  {{ name }}.  \r\nSecond line.\r\n\r\n\r\n\r\nLast.\r\n"));
        Files.setPosixFilePermissions(crlf, PosixFilePermissions.fromString("rwxr-x---"));
        Path mixed = write("prompts/mixed.md", "One.\t\r\nTwo  words.\nThree.\r\n");
        Path open = write("prompts/open.md", "No final break.   ");
        Cli.Run run = Cli.run("fix", dir.toString());
        assertEquals(0, run.exitCode(), run.out() + run.err());
        assertArrayEquals(bom("Hello {{ name }}.\r\nSecond line.\r\n\r\nLast.\r\n"), Files.readAllBytes(crlf));
        assertEquals("rwxr-x---", PosixFilePermissions.toString(Files.getPosixFilePermissions(crlf)));
        assertEquals("One.\r\nTwo words.\nThree.\r\n", Files.readString(mixed), "mixed endings stay as they were");
        assertEquals("No final break.", Files.readString(open));
        assertEquals(List.of("crlf.md", "mixed.md", "open.md"), folder(dir.resolve("prompts")), "no temporary file is left");
    }

    @Test
    void filesWithNothingToFixAreNotTouched() throws IOException {
        repo();
        Path clean = write("prompts/clean.md", "Nothing to fix here.\n");
        write("prompts/messy.md", "Fix  me.\n");
        FileTime old = FileTime.fromMillis(1_000_000_000_000L);
        Files.setLastModifiedTime(clean, old);
        assertEquals(0, Cli.run("fix", dir.toString()).exitCode());
        assertEquals(old, Files.getLastModifiedTime(clean));
        assertEquals("Fix me.\n", Files.readString(dir.resolve("prompts/messy.md")));
    }

    @Test
    void aFailureAfterTheTempFileIsWrittenLeavesTheOriginalAndNoTempFile() throws IOException {
        repo();
        Path file = write("prompts/a.md", "Fix  me.\n");
        FileSystemOps failing = new FileSystemOps() {
            @Override
            public void writeAndSync(Path target, byte[] bytes) throws IOException {
                FileSystemOps.DEFAULT.writeAndSync(target, bytes);
                throw new IOException("injected failure after the temporary file was written");
            }
        };
        Cli.Run run = runWith(failing, "fix", dir.toString());
        assertEquals(1, run.exitCode());
        assertTrue(run.out().contains("prompts/a.md: writing it failed"), run.out());
        assertEquals("Fix  me.\n", Files.readString(file));
        assertEquals(List.of("a.md"), folder(dir.resolve("prompts")));
    }

    @Test
    void aFailureAtTheRenameLeavesTheOriginalAndNoTempFile() throws IOException {
        repo();
        Path file = write("prompts/a.md", "Fix  me.\n");
        write("prompts/b.md", "Me  too.\n");
        FileSystemOps failing = new FileSystemOps() {
            @Override
            public void moveAtomically(Path source, Path target) throws IOException {
                if (target.getFileName().toString().equals("a.md")) {
                    throw new IOException("injected failure at the rename");
                }
                FileSystemOps.DEFAULT.moveAtomically(source, target);
            }
        };
        Cli.Run run = runWith(failing, "fix", dir.toString());
        assertEquals(1, run.exitCode());
        assertTrue(run.out().contains("injected failure at the rename"), run.out());
        assertEquals("Fix  me.\n", Files.readString(file));
        assertEquals("Me too.\n", Files.readString(dir.resolve("prompts/b.md")), "the other file is still fixed");
        assertEquals(List.of("a.md", "b.md"), folder(dir.resolve("prompts")));
    }

    @Test
    void aFileChangedMeanwhileIsLeftAsItIs() throws IOException {
        repo();
        Path file = write("prompts/a.md", "Fix  me.\n");
        FileSystemOps editedMeanwhile = new FileSystemOps() {
            @Override
            public Path createTemp(Path folder, String prefix) throws IOException {
                Files.writeString(file, "Someone else's edit.  \n");
                return FileSystemOps.DEFAULT.createTemp(folder, prefix);
            }
        };
        Cli.Run run = runWith(editedMeanwhile, "fix", dir.toString());
        assertEquals(1, run.exitCode());
        assertTrue(run.out().contains("it changed on disk after it was read"), run.out());
        assertEquals("Someone else's edit.  \n", Files.readString(file));
        assertEquals(List.of("a.md"), folder(dir.resolve("prompts")));
    }

    @Test
    void aFileTheUserMayNotWriteIsNotRewritten() throws IOException {
        repo();
        Path file = write("prompts/a.md", "Fix  me.\n");
        // Tests may run as a superuser, whom the operating system lets write anything: refuse through the seam.
        FileSystemOps readOnly = new FileSystemOps() {
            @Override
            public boolean isWritable(Path target) {
                return false;
            }
        };
        Cli.Run run = runWith(readOnly, "fix", dir.toString());
        assertEquals(1, run.exitCode());
        assertTrue(run.out().contains("it is read-only for you"), run.out());
        assertEquals("Fix  me.\n", Files.readString(file));
    }

    @Test
    void aWrittenFileKeepsItsPermissions() throws IOException {
        repo();
        Path file = write("prompts/a.md", "Fix  me.\n");
        Set<PosixFilePermission> readOnly = Set.of(PosixFilePermission.OWNER_READ, PosixFilePermission.GROUP_READ);
        Files.setPosixFilePermissions(file, readOnly);
        org.junit.jupiter.api.Assumptions.assumeTrue(Files.isWritable(file), "only a superuser may write a read-only file");
        Cli.Run run = Cli.run("fix", dir.toString());
        assertEquals(0, run.exitCode(), run.out());
        assertEquals("Fix me.\n", Files.readString(file));
        assertEquals(readOnly, Files.getPosixFilePermissions(file));
    }

    @Test
    void aLinkStaysALinkAndItsTargetIsFixedOnce() throws IOException {
        repo();
        Path target = write("prompts/real.md", "Fix  me.\n");
        Path link = Files.createSymbolicLink(dir.resolve("prompts/link.md"), target.getFileName());
        Cli.Run run = Cli.run("fix", dir.toString());
        assertEquals(0, run.exitCode(), run.out());
        assertTrue(Files.isSymbolicLink(link));
        assertEquals("Fix me.\n", Files.readString(target));
        assertTrue(run.out().contains("prompts/real.md: the same file as prompts/link.md"), run.out());
    }

    @Test
    void aPartialIsRewrittenOnceInItsOwnFile() throws IOException {
        repo();
        String partial = "Be kind.  \n";
        write("prompts/partials/tone.md", partial);
        write("prompts/a.md", "{{> tone }}\nFirst.\n");
        write("prompts/b.md", "{{> tone }}\nSecond.\n");
        JsonNode report = new ObjectMapper().readTree(Cli.run("fix", dir.toString(), "--format", "json").out());
        assertEquals(1, report.get("files").size(), report.toString());
        assertEquals("prompts/partials/tone.md", report.get("files").get(0).get("path").asText());
        assertEquals(1, report.get("summary").get("rules").get(0).get("rewrites").asInt());
        assertEquals("Be kind.\n", Files.readString(dir.resolve("prompts/partials/tone.md")));
        assertEquals("{{> tone }}\nFirst.\n", Files.readString(dir.resolve("prompts/a.md")));
    }

    @Test
    void onlyLimitsTheRulesAndDryRunWritesNothing() throws IOException {
        repo();
        Path file = write("prompts/a.md", "Fix  me.  \n");
        Cli.Run dry = Cli.run("fix", dir.toString(), "--dry-run", "--only", "space-run");
        assertEquals(0, dry.exitCode());
        assertTrue(dry.out().contains("-Fix  me.  \n+Fix me.  \n"), dry.out());
        assertEquals("Fix  me.  \n", Files.readString(file));
        assertEquals(0, Cli.run("fix", dir.toString(), "--only", "space-run").exitCode());
        assertEquals("Fix me.  \n", Files.readString(file));
    }

    @Test
    void usageErrorsExitTwoWithOneLine() throws IOException {
        repo();
        write("prompts/a.md", "Fix  me.\n");
        Cli.Run unknown = Cli.run("fix", dir.toString(), "--only", "space-runs");
        assertEquals(2, unknown.exitCode());
        assertTrue(unknown.err().contains("unknown rule 'space-runs'; did you mean 'space-run'?"), unknown.err());
        Cli.Run review = Cli.run("fix", dir.toString(), "--only", "costly-character");
        assertEquals(2, review.exitCode());
        assertTrue(review.err().contains("add --include-review"), review.err());
        Cli.Run none = Cli.run("fix", dir.toString(), "--only", "over-budget");
        assertEquals(2, none.exitCode());
        assertTrue(none.err().contains("offers no rewrite"), none.err());
        assertEquals(2, Cli.run("fix", dir.toString(), "--format", "sarif").exitCode());
        assertEquals(2, Cli.run("fix", dir.resolve("missing").toString()).exitCode());
        assertEquals("Fix  me.\n", Files.readString(dir.resolve("prompts/a.md")));
    }

    @Test
    void aDollarDoubleBraceTemplateIsFixedAroundItsCallsAndCountedAsWritten() throws IOException {
        Files.writeString(dir.resolve("tare.yaml"), CONFIG + "  placeholder: dollar-double-brace\n");
        String before = "Check  the meter.   \nReading: {{meter.read  $account unit='m3'}} for {{$name}}.\n";
        Path file = write("prompts/a.md", before);
        Cli.Run run = Cli.run("fix", dir.toString(), "--format", "json");
        assertEquals(0, run.exitCode(), run.out() + run.err());
        String after = "Check the meter.\nReading: {{meter.read  $account unit='m3'}} for {{$name}}.\n";
        assertEquals(after, Files.readString(file), "the white space inside a call is part of the call");
        JsonNode tokens = new ObjectMapper().readTree(run.out()).get("files").get(0).get("tokens").get("o200k_base");
        Tokenizer o200k = new TokenizerRegistry().get("o200k_base", Path.of("."));
        assertEquals(o200k.count(before), tokens.get("before").asInt());
        assertEquals(o200k.count(after), tokens.get("after").asInt());
    }

    @Test
    void nothingToFixExitsZero() throws IOException {
        repo();
        write("prompts/a.md", "Clean.\n");
        Cli.Run run = Cli.run("fix", dir.toString());
        assertEquals(0, run.exitCode());
        assertEquals("Nothing to fix in 1 template.\n", run.out());
    }

    @Test
    void jsonOutputCarriesToolVersionOutcomesAndNoColour() throws IOException {
        repo();
        write("prompts/a.md", "Fix  me.\n");
        Cli.Run run = Cli.run("fix", dir.toString(), "--format", "json", "--dry-run");
        assertFalse(run.out().contains("\u001b["));
        JsonNode report = new ObjectMapper().readTree(run.out());
        assertEquals("tare", report.get("tool").asText());
        assertTrue(report.has("version"));
        JsonNode file = report.get("files").get(0);
        assertEquals("planned", file.get("outcome").asText());
        assertTrue(file.get("diff").asText().startsWith("--- a/prompts/a.md\n+++ b/prompts/a.md\n"));
        JsonNode tokens = file.get("tokens").get("o200k_base");
        assertTrue(tokens.get("after").asInt() < tokens.get("before").asInt(), tokens.toString());
        assertEquals(tokens.get("before").asInt() - tokens.get("after").asInt(), tokens.get("saved").asInt());
        assertTrue(report.get("summary").get("note").asText().contains("not measurements or invoices"));
    }

    @Test
    void aRewriteThatFailsVerificationIsDroppedAndReported() throws IOException {
        repo();
        Path file = write("prompts/a.md", "First line.\n\u200B\nSecond line.\n");
        Cli.Run run = Cli.run("fix", dir.toString());
        assertEquals(1, run.exitCode());
        assertTrue(run.out().contains("prompts/a.md: rewrite dropped, nothing written: a paragraph break was added"), run.out());
        assertEquals("First line.\n\u200B\nSecond line.\n", Files.readString(file));
    }

    @Test
    void rewritesThatNeverSettleAreDropped() throws IOException {
        Files.writeString(dir.resolve("tare.yaml"), CONFIG + "rules: {packs: [rules]}\n");
        write("rules/flip.yaml", "rules:\n"
                + "  - {id: flip-on, summary: \"on to off.\", why: \"test.\", class: review, severity: info, scope: prose,"
                + " find: '\\bon\\b', replace: 'off', examples: [{before: \"on\\n\", after: \"off\\n\"}]}\n"
                + "  - {id: flip-off, summary: \"off to on.\", why: \"test.\", class: review, severity: info, scope: prose,"
                + " find: '\\boff\\b', replace: 'on', examples: [{before: \"off\\n\", after: \"on\\n\"}]}\n");
        Path file = write("prompts/a.md", "Switch it on.\n");
        Cli.Run run = Cli.run("fix", dir.toString(), "--include-review");
        assertEquals(1, run.exitCode(), run.err());
        assertTrue(run.out().contains("still change it after 8 rounds"), run.out());
        assertEquals("Switch it on.\n", Files.readString(file));
    }
}
