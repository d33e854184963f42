package dev.tare.app;

import dev.tare.lint.CrossTemplateRule;
import dev.tare.lint.Finding;
import dev.tare.lint.LintContext;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.tare.TareException;
import dev.tare.source.SourceText;
import dev.tare.template.Template;
import dev.tare.tokenize.TokenizerRegistry;
import dev.tare.workspace.Workspace;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * A check lets each template go once the per-template rules have run on it; the cross-template
 * rules then parse again only what they need. These tests pin that this gives the findings a run
 * holding every template gives, and that a file edited between the two passes stops the check with
 * a one-line error rather than findings about text that is no longer there.
 */
class CheckAcrossTemplatesTest {
    private static final String BLOCK = "Never promise a refund, a repair time or a bill credit that the account notes"
            + " do not show, and never read out a full account number, a bank detail or a password.";

    @TempDir
    Path dir;
    private Workspace workspace;

    @BeforeEach
    void repository() throws IOException {
        write("tare.yaml", "templates:\n  include: [\"prompts/**/*.md\"]\n  partials: prompts/partials\n"
                + "rules: {limits: {shared_block_tokens: 20}}\n");
        write("prompts/billing.md", "# Billing\n\n" + BLOCK + "\n\nExplain the bill.\n");
        write("prompts/outages.md", "# Outages\n\n" + BLOCK + "\n\nGive the area.\n");
        write("prompts/leaks.md", "# Leaks\n\nAsk where the water comes from. {# tare-ignore shared-block #}\n");
        workspace = Workspace.open(List.of(dir), Optional.empty());
    }

    @Test
    void crossTemplateFindingsAreThoseOfARunHoldingEveryTemplate() {
        Check check = new Check(workspace, new TokenizerRegistry());
        List<Finding> checked = check.run(CheckOptions.defaults()).findings().stream()
                .filter(f -> f.rule().equals("shared-block")).toList();
        assertEquals(1, checked.size(), checked.toString());

        TemplateLoader loader = new TemplateLoader(workspace);
        List<Template> held = new ArrayList<>();
        for (String path : loader.find().paths()) {
            held.add(loader.load(path));
        }
        LintContext context = new LintContext(workspace.config(), new TokenizerRegistry(), loader.renderer(), held,
                check.catalog().ids(), Map.of());
        CrossTemplateRule rule = (CrossTemplateRule) check.catalog().rule("shared-block");
        List<Finding> expected = rule.checkAll(context).stream()
                .map(f -> f.withSeverity(check.catalog().severity(rule.descriptor()))).toList();
        assertEquals(expected, checked);
    }

    @Test
    void aTemplateEditedBetweenThePassesStopsTheCheckWithOneLine() {
        Check check = new Check(workspace, new TokenizerRegistry());
        TemplateLoader loader = new TemplateLoader(workspace);
        Map<String, Integer> reads = new HashMap<>();
        TareException e = assertThrows(TareException.class, () -> check.run(CheckOptions.defaults(), loader,
                loader.find(), path -> {
                    SourceText text = loader.read(path);
                    if (reads.merge(path, 1, Integer::sum) > 1 && path.equals("prompts/billing.md")) {
                        String edited = text.text().replace("Explain", "Explain briefly");
                        return new SourceText(path, text.file(), edited, text.hadBom(), edited.length());
                    }
                    return text;
                }));
        assertEquals("prompts/billing.md changed while it was checked; run the check again", e.getMessage());
        assertTrue(reads.get("prompts/billing.md") > 1);
    }

    private void write(String path, String text) throws IOException {
        Path file = dir.resolve(path);
        Files.createDirectories(file.getParent());
        Files.writeString(file, text);
    }
}
