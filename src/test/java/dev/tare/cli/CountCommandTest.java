package dev.tare.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import dev.tare.tokenize.TokenizerRegistry;
import java.io.ByteArrayInputStream;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class CountCommandTest {
    @TempDir
    Path dir;

    private static int reference(String encoding, String text) {
        return new TokenizerRegistry().get(encoding, Path.of(".")).count(text);
    }

    @Test
    void countsWholeFilesIncludingFrontMatterAndWithoutTheBom() throws Exception {
        String text = "---\nbudget: 5\n---\nHello {{ name }} <|endoftext|>\n";
        Path a = Files.writeString(dir.resolve("a.md"), text);
        byte[] withBom = ("\uFEFF" + text).getBytes(StandardCharsets.UTF_8);
        Path b = Files.write(dir.resolve("b.md"), withBom);
        Cli.Run run = Cli.run("count", "--format", "json", "--tokenizer", "cl100k_base", a.toString(), b.toString());
        assertEquals(0, run.exitCode(), run.err());
        JsonNode root = new ObjectMapper().readTree(run.out());
        assertEquals("tare", root.get("tool").asText());
        assertEquals("cl100k_base", root.get("tokenizer").asText());
        int expected = reference("cl100k_base", text);
        assertEquals(expected, root.get("files").get(0).get("tokens").asInt());
        assertEquals(expected, root.get("files").get(1).get("tokens").asInt(), "the BOM is not counted");
        assertEquals(text.length(), root.get("files").get(1).get("chars").asInt());
        assertEquals(2L * expected, root.get("total").get("tokens").asLong());
    }

    @Test
    void anAtListNamesOneFilePerLineSpacesIncluded() throws Exception {
        Path a = Files.writeString(dir.resolve("a.md"), "First file.\n");
        Path b = Files.writeString(dir.resolve("with space.md"), "Second file, longer than the first.\n");
        Path list = Files.writeString(dir.resolve("files.txt"), a + "\r\n\n" + b + "\n");
        Cli.Run listed = Cli.run("count", "--format", "json", "@" + list);
        Cli.Run named = Cli.run("count", "--format", "json", a.toString(), b.toString());
        assertEquals(0, listed.exitCode(), listed.err());
        assertEquals(named.out(), listed.out());
        assertEquals(2, new ObjectMapper().readTree(listed.out()).get("files").size());

        Cli.Run missing = Cli.run("count", "@" + dir.resolve("no-such-list.txt"));
        assertEquals(2, missing.exitCode());
        assertTrue(missing.err().startsWith("tare: ") && missing.err().contains("no-such-list.txt: no such list of files;"),
                missing.err());
    }

    @Test
    void readsStandardInputForADash() throws Exception {
        InputStream saved = System.in;
        try {
            System.setIn(new ByteArrayInputStream("piped text".getBytes(StandardCharsets.UTF_8)));
            Cli.Run run = Cli.run("count", "-");
            assertEquals(0, run.exitCode(), run.err());
            assertTrue(run.out().contains(reference("o200k_base", "piped text") + "  ") && run.out().contains("-"), run.out());
        } finally {
            System.setIn(saved);
        }
    }

    @Test
    void aBadFileIsReportedAndTheOthersStillCounted() throws Exception {
        Path good = Files.writeString(dir.resolve("good.md"), "fine");
        Path binary = Files.write(dir.resolve("bin.md"), new byte[] {1, 0, 2});
        Cli.Run run = Cli.run("count", "--format", "json", binary.toString(), good.toString(), dir.resolve("missing.md").toString());
        assertEquals(2, run.exitCode());
        assertTrue(run.err().contains("bin.md: binary file (NUL byte at offset 1)"), run.err());
        assertTrue(run.err().contains("missing.md: no such file"), run.err());
        assertEquals(1, new ObjectMapper().readTree(run.out()).get("files").size());
    }

    @Test
    void aFolderIsReportedAsOne() throws Exception {
        Path folder = Files.createDirectory(dir.resolve("prompts"));
        Cli.Run run = Cli.run("count", folder.toString());
        assertEquals(2, run.exitCode());
        assertTrue(run.err().contains("prompts: is a folder; count takes files"), run.err());
    }

    @Test
    void unknownTokenizerIsAUsageError() {
        Cli.Run run = Cli.run("count", "--tokenizer", "nonsense", "pom.xml");
        assertEquals(2, run.exitCode());
        assertTrue(run.err().startsWith("tare: unknown tokenizer 'nonsense': use one of o200k_base, cl100k_base"), run.err());
    }
}
