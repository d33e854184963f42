package dev.tare.app;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.tare.lint.Rule;
import java.io.IOException;
import java.io.OutputStream;
import java.net.URL;
import java.net.URLClassLoader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.jar.JarEntry;
import java.util.jar.JarOutputStream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** The built-in packs are read from a jar by the index the build writes, never by listing the jar. */
class PackIndexTest {
    private static final String PACK = """
            rules:
              - id: kindly-note
                summary: "'kindly note that' where 'note that' says the same."
                why: "Two words for nothing."
                class: review
                severity: info
                scope: prose
                find: '\\b[Kk]indly note that\\b'
                replace: 'note that'
                examples:
                  - before: "Kindly note that the office is closed.\\n"
                    after: "note that the office is closed.\\n"
            """;

    @TempDir
    Path folder;

    @Test
    void theBuildIndexedEveryPackOfTheRepository() throws IOException {
        List<String> indexed = new String(getClass().getClassLoader().getResourceAsStream(PackIndex.INDEX).readAllBytes(),
                StandardCharsets.UTF_8).lines().toList();
        assertEquals(PackIndex.names(Path.of(RulePacks.FOLDER)), indexed);
        assertTrue(!indexed.isEmpty(), "the repository ships at least one pack");
    }

    @Test
    void packsAreReadFromAJarByItsIndex() throws IOException {
        Map<String, String> entries = new LinkedHashMap<>();
        entries.put("rules/index.txt", "style.yaml\n");
        entries.put("rules/style.yaml", PACK);
        entries.put("rules/ignored.yaml", "not: [a pack, and not listed]");
        try (URLClassLoader loader = jar(entries)) {
            List<Rule> rules = RulePacks.builtIn(loader);
            assertEquals(List.of("kindly-note"), rules.stream().map(r -> r.descriptor().id()).toList());
        }
    }

    @Test
    void aJarWithoutItsIndexOrAListedPackIsAPackagingBug() throws IOException {
        try (URLClassLoader noIndex = jar(Map.of("rules/style.yaml", PACK))) {
            IllegalStateException e = assertThrows(IllegalStateException.class, () -> RulePacks.builtIn(noIndex));
            assertTrue(e.getMessage().contains("index.txt"), e.getMessage());
        }
        try (URLClassLoader missing = jar(Map.of("rules/index.txt", "gone.yaml\n"))) {
            IllegalStateException e = assertThrows(IllegalStateException.class, () -> RulePacks.builtIn(missing));
            assertTrue(e.getMessage().contains("rules/gone.yaml"), e.getMessage());
        }
    }

    @Test
    void theShippedPacksLoad() {
        List<Rule> rules = RulePacks.builtIn();
        assertTrue(rules.stream().anyMatch(r -> r.descriptor().id().equals("in-order-to")));
        assertTrue(rules.stream().allMatch(r -> r.descriptor().origin().startsWith("rules/")));
    }

    /** A jar of {@code entries} (with the folder entry a packaged jar has), seen by a loader with no parent. */
    private URLClassLoader jar(Map<String, String> entries) throws IOException {
        Path jar = Files.createTempFile(folder, "packs", ".jar");
        try (OutputStream file = Files.newOutputStream(jar); JarOutputStream out = new JarOutputStream(file)) {
            out.putNextEntry(new JarEntry("rules/"));
            out.closeEntry();
            for (Map.Entry<String, String> entry : entries.entrySet()) {
                out.putNextEntry(new JarEntry(entry.getKey()));
                out.write(entry.getValue().getBytes(StandardCharsets.UTF_8));
                out.closeEntry();
            }
        }
        return new URLClassLoader(new URL[] {jar.toUri().toURL()}, null);
    }
}
