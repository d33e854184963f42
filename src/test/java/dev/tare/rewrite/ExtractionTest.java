package dev.tare.rewrite;

import dev.tare.app.Fix;
import dev.tare.app.FixResult;
import dev.tare.workspace.FileSystemOps;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.tare.app.TemplateLoader;
import dev.tare.template.Renderer;
import dev.tare.template.Template;
import dev.tare.tokenize.TokenizerRegistry;
import dev.tare.workspace.Workspace;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import java.util.TreeMap;
import java.util.stream.Stream;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Moving a shared block into a partial with {@code tare fix --include-review}: every changed template
 * must render exactly as before (checked here by rendering each template of the repository as it was
 * and as it is after the fix, with variables empty and with samples, and comparing the text byte for
 * byte); what cannot be proven is refused with a reason and left as it is; a file is never replaced by
 * a new partial.
 */
class ExtractionTest {
    private static final String SAFETY = """
            ## Safety

            Never promise a refund, a repair time or a bill credit that the account notes do
            not show, and never read out a full account number, a bank detail or a password.""";

    @TempDir
    Path dir;
    @TempDir
    Path pristine;

    @BeforeEach
    void repository() throws IOException {
        write("tare.yaml", """
                templates:
                  include: ["prompts/**/*.md", "prompts/**/*.chat.yaml"]
                  partials: prompts/partials
                rules: {limits: {shared_block_tokens: 30}}
                """);
        write("prompts/billing.md", "---\nvariables:\n  name: {sample: \"Ana\"}\n---\n# Billing for {{ name }}\n\n" + SAFETY
                + "\n\n## The bill\n\nExplain each line of the bill.\n");
        write("prompts/outages.md", "# Outages\n\n" + SAFETY + "\n\n## The outage\n\nGive the area: {{ area }}.\n");
        write("prompts/plans.chat.yaml", "messages:\n  - role: system\n    content: |\n      You set up payment plans.\n\n"
                + SAFETY.indent(6) + "\n      Offer at most twelve months.\n  - role: user\n    content: \"{{ question }}\"\n");
        write("prompts/leaks.md", "# Leaks\n\n" + SAFETY.replace("do\nnot show", "do not\nshow") + "\n\n## The leak\n\nAsk about it.\n");
    }

    @Test
    void everyChangedTemplateRendersExactlyAsBefore() throws IOException {
        copy(dir, pristine);
        FixResult result = fix(false);
        assertEquals(List.of("prompts/partials/safety.md"), result.created().stream().map(FileFix::path).toList());
        assertEquals(SAFETY + "\n", read("prompts/partials/safety.md"));
        assertTrue(read("prompts/billing.md").contains("# Billing for {{ name }}\n\n{{> safety }}\n## The bill\n"));
        assertTrue(read("prompts/plans.chat.yaml").contains("      You set up payment plans.\n\n      {{> safety }}\n"
                + "      Offer at most twelve months.\n"), read("prompts/plans.chat.yaml"));
        assertEquals(Files.readString(pristine.resolve("prompts/leaks.md")), read("prompts/leaks.md"));
        for (String path : List.of("prompts/billing.md", "prompts/outages.md", "prompts/plans.chat.yaml", "prompts/leaks.md")) {
            assertEquals(rendered(pristine, path), rendered(dir, path), path);
        }
        // The copy reflowed at another point stays, with its reason, and makes the run count as not all fixed.
        assertEquals(1, result.refused().size());
        assertEquals("prompts/leaks.md", result.refused().get(0).path());
        assertEquals(3, result.refused().get(0).line());
        assertTrue(result.refused().get(0).reason().contains("differs from prompts/partials/safety.md in whitespace"));
        assertTrue(result.failed());
    }

    @Test
    void aSecondFixChangesNothing() throws IOException {
        fix(false);
        copy(dir, pristine);
        FixResult again = fix(false);
        assertEquals(List.of(), again.applied());
        assertEquals(snapshot(pristine), snapshot(dir));
    }

    @Test
    void aDryRunWritesNothing() throws IOException {
        copy(dir, pristine);
        FixResult result = fix(true);
        assertEquals(1, result.created().size());
        assertEquals(FileFix.Outcome.PLANNED, result.created().get(0).outcome());
        assertEquals(snapshot(pristine), snapshot(dir));
    }

    @Test
    void aBlockThatWouldRenderDifferentlyIsRefusedAndNothingIsWritten() throws IOException {
        // Inside raw the braces are literal text; in a partial of their own they would be a variable, and
        // the include would be literal text inside raw. Either way the rendering changes, so no extraction.
        Files.delete(dir.resolve("prompts/leaks.md"));
        String literal = "Write booking codes as {{ CODE }} in the confirmation, literally, and never fill them in;"
                + " the crew reads them aloud at the gangway before anyone boards.";
        write("prompts/billing.md", "Billing first.\n\n{% raw %}" + literal + "{% endraw %}\n\nEnd of billing.\n");
        write("prompts/outages.md", "Outages first.\n\n{% raw %}" + literal + "{% endraw %}\n\nEnd of outages.\n");
        write("prompts/plans.chat.yaml", "messages:\n  - role: system\n    content: Plans.\n");
        copy(dir, pristine);
        FixResult result = fix(false);
        assertEquals(List.of(), result.applied());
        assertEquals(2, result.refused().size());
        assertTrue(result.refused().get(0).reason().contains("would render differently"), result.refused().get(0).reason());
        assertEquals(snapshot(pristine), snapshot(dir));
    }

    @Test
    void anExistingFileIsNeverReplaced() throws IOException {
        write("prompts/partials/safety.md", "Something else entirely.\n");
        FixResult result = fix(false);
        assertEquals(List.of("prompts/partials/safety-2.md"), result.created().stream().map(FileFix::path).toList());
        assertEquals("Something else entirely.\n", read("prompts/partials/safety.md"));
        assertTrue(read("prompts/billing.md").contains("{{> safety-2 }}"));
    }

    @Test
    void aFileAppearingWhereThePartialGoesStopsEveryTemplateThatWouldIncludeIt() throws IOException {
        copy(dir, pristine);
        FileSystemOps raced = new FileSystemOps() {
            @Override
            public boolean moveIfAbsent(Path source, Path target) throws IOException {
                Files.writeString(target, "Written by someone else meanwhile.\n");
                return FileSystemOps.super.moveIfAbsent(source, target);
            }
        };
        FixResult result = new Fix(workspace(), new TokenizerRegistry(), raced)
                .run(new FixOptions(true, Set.of("shared-block"), false));
        assertEquals(FileFix.Outcome.CHANGED_MEANWHILE, outcome(result, "prompts/partials/safety.md"));
        assertEquals(FileFix.Outcome.NOT_WRITTEN, outcome(result, "prompts/billing.md"));
        assertEquals("Written by someone else meanwhile.\n", read("prompts/partials/safety.md"));
        Map<String, String> after = snapshot(dir);
        after.remove("prompts/partials/safety.md");
        assertEquals(snapshot(pristine), after, "no template changed, and no temporary file is left");
    }

    private static FileFix.Outcome outcome(FixResult result, String path) {
        return result.files().stream().filter(f -> f.path().equals(path)).findFirst().orElseThrow().outcome();
    }

    private FixResult fix(boolean dryRun) {
        return new Fix(workspace(), new TokenizerRegistry(), FileSystemOps.DEFAULT)
                .run(new FixOptions(true, Set.of("shared-block"), dryRun));
    }

    private Workspace workspace() {
        return Workspace.open(List.of(dir), Optional.empty());
    }

    /** The template's rendering with variables empty and with samples, message by message. */
    private static String rendered(Path root, String path) {
        TemplateLoader loader = new TemplateLoader(Workspace.open(List.of(root), Optional.empty()));
        Template template = loader.load(path);
        Renderer renderer = loader.renderer();
        return String.join("\u0000", renderer.renderStatic(template).messages()) + "\u0001"
                + String.join("\u0000", renderer.renderWithSamples(template).messages());
    }

    private String read(String path) throws IOException {
        return Files.readString(dir.resolve(path));
    }

    private void write(String path, String text) throws IOException {
        Path file = dir.resolve(path);
        Files.createDirectories(file.getParent());
        Files.writeString(file, text, StandardCharsets.UTF_8);
    }

    private static void copy(Path from, Path to) throws IOException {
        try (Stream<Path> files = Files.walk(from)) {
            for (Path file : files.filter(Files::isRegularFile).toList()) {
                Path target = to.resolve(from.relativize(file).toString());
                Files.createDirectories(target.getParent());
                Files.copy(file, target, java.nio.file.StandardCopyOption.REPLACE_EXISTING);
            }
        }
    }

    private static Map<String, String> snapshot(Path root) throws IOException {
        Map<String, String> files = new TreeMap<>();
        try (Stream<Path> walk = Files.walk(root)) {
            for (Path file : walk.filter(Files::isRegularFile).toList()) {
                files.put(root.relativize(file).toString().replace('\\', '/'), Files.readString(file));
            }
        }
        return files;
    }
}
