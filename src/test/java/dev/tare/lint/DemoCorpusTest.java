package dev.tare.lint;

import dev.tare.app.Check;
import dev.tare.app.CheckOptions;
import dev.tare.app.CheckResult;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.tare.tokenize.TokenizerRegistry;
import dev.tare.workspace.Workspace;
import java.nio.file.Path;
import java.util.List;
import java.util.Optional;
import java.util.stream.Stream;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import org.junit.jupiter.params.provider.ValueSource;

/**
 * {@code check} on the demo corpus finds the waste planted there and nothing on the clean templates.
 * Every expected position comes from {@code corpora/demo/WASTE.md} (lines and code-point columns over
 * the whole file), the corpus's own record of what was planted.
 */
class DemoCorpusTest {
    private static final Path DEMO = Path.of(System.getProperty("tare.project.dir", ".")).resolve("corpora/demo");
    private static CheckResult result;

    @BeforeAll
    static void check() {
        result = new Check(Workspace.open(List.of(DEMO), Optional.empty()), new TokenizerRegistry()).run(CheckOptions.defaults());
    }

    static Stream<Arguments> planted() {
        return Stream.of(
                // WASTE.md "Whitespace"
                Arguments.of("prompts/billing/explain-bill.md", 13, 0, "trailing-whitespace"),
                Arguments.of("prompts/billing/explain-bill.md", 32, 0, "trailing-whitespace"),
                Arguments.of("prompts/billing/explain-bill.md", 41, 0, "trailing-whitespace"),
                Arguments.of("prompts/leaks/leak-triage.md", 16, 0, "trailing-whitespace"),
                Arguments.of("prompts/leaks/leak-triage.md", 19, 0, "trailing-whitespace"),
                Arguments.of("prompts/connections/new-service.md", 14, 0, "trailing-whitespace"),
                Arguments.of("prompts/connections/new-service.md", 34, 0, "trailing-whitespace"),
                Arguments.of("prompts/partials/account-lookup-notes.md", 4, 0, "trailing-whitespace"),
                Arguments.of("prompts/partials/account-lookup-notes.md", 6, 0, "trailing-whitespace"),
                Arguments.of("prompts/agents/field-crew-work-order.md", 16, 0, "trailing-whitespace"),
                Arguments.of("prompts/agents/field-crew-work-order.md", 82, 0, "trailing-whitespace"),
                Arguments.of("prompts/outages/outage-status.md", 26, 1, "blank-lines"),
                Arguments.of("prompts/outages/outage-status.md", 45, 1, "blank-lines"),
                Arguments.of("prompts/agents/field-crew-work-order.md", 57, 1, "blank-lines"),
                Arguments.of("prompts/agents/field-crew-work-order.md", 153, 1, "blank-lines"),
                Arguments.of("prompts/agents/field-crew-work-order.md", 361, 1, "blank-lines"),
                Arguments.of("prompts/agents/field-crew-work-order.md", 42, 58, "space-run"),
                Arguments.of("prompts/meters/reading-dispute.md", 15, 20, "space-run"),
                Arguments.of("prompts/meters/reading-dispute.md", 15, 315, "space-run"),
                Arguments.of("prompts/meters/reading-dispute.md", 15, 448, "space-run"),
                Arguments.of("prompts/meters/reading-dispute.md", 15, 600, "space-run"),
                Arguments.of("prompts/outages/outage-report.chat.yaml", 32, 20, "space-run"),
                Arguments.of("prompts/outages/outage-report.chat.yaml", 32, 42, "space-run"),
                Arguments.of("prompts/outages/outage-report.chat.yaml", 33, 39, "space-run"),
                Arguments.of("prompts/connections/connection-checklist.chat.json", 3, 214, "space-run"),
                Arguments.of("prompts/connections/connection-checklist.chat.json", 3, 673, "space-run"),
                Arguments.of("prompts/leaks/leak-triage.md", 37, 22, "prose-tab"),
                Arguments.of("prompts/agents/field-crew-work-order.md", 228, 25, "prose-tab"),
                // "Decorative rulers"
                Arguments.of("prompts/system/assistant.md", 16, 1, "decorative-ruler"),
                Arguments.of("prompts/agents/field-crew-work-order.md", 11, 1, "decorative-ruler"),
                Arguments.of("prompts/agents/field-crew-work-order.md", 21, 1, "decorative-ruler"),
                Arguments.of("prompts/connections/new-service.md", 9, 1, "decorative-ruler"),
                Arguments.of("prompts/connections/new-service.md", 29, 1, "decorative-ruler"),
                Arguments.of("prompts/outages/outage-status.md", 9, 1, "decorative-ruler"),
                Arguments.of("prompts/outages/outage-status.md", 49, 1, "decorative-ruler"),
                Arguments.of("prompts/quality/quality-notice.md", 6, 1, "decorative-ruler"),
                Arguments.of("prompts/quality/quality-notice.md", 8, 1, "decorative-ruler"),
                Arguments.of("prompts/quality/quality-notice.md", 53, 1, "decorative-ruler"),
                // "Pretty-printed JSON": the finding starts on the line after the opening fence
                Arguments.of("prompts/billing/explain-bill.md", 49, 1, "pretty-json-block"),
                Arguments.of("prompts/leaks/leak-triage.md", 53, 1, "pretty-json-block"),
                Arguments.of("prompts/meters/reading-dispute.md", 50, 1, "pretty-json-block"),
                Arguments.of("prompts/connections/new-service.md", 53, 1, "pretty-json-block"),
                Arguments.of("prompts/agents/field-crew-work-order.md", 276, 1, "pretty-json-block"),
                Arguments.of("prompts/tools/lookup-account.md", 19, 1, "pretty-json-block"),
                Arguments.of("prompts/tools/create-work-order.md", 17, 1, "pretty-json-block"),
                Arguments.of("prompts/tools/schedule-meter-reread.md", 17, 1, "pretty-json-block"),
                Arguments.of("prompts/few-shot/intent-examples.md", 67, 1, "pretty-json-block"),
                Arguments.of("prompts/few-shot/intent-examples.md", 420, 1, "pretty-json-block"),
                // "Repeated and near-duplicate instructions"
                Arguments.of("prompts/leaks/leak-triage.md", 39, 1, "repeated-instruction"),
                Arguments.of("prompts/billing/payment-plan.chat.yaml", 35, 0, "near-duplicate-instruction"),
                // "Invisible characters"
                Arguments.of("prompts/leaks/leak-followup.chat.yaml", 22, 61, "invisible-character"),
                Arguments.of("prompts/meters/reading-dispute.md", 72, 27, "invisible-character"),
                Arguments.of("prompts/quality/quality-notice.md", 50, 44, "invisible-character"),
                Arguments.of("prompts/connections/new-service.md", 76, 21, "invisible-character"),
                // "Costly characters": the emoji and check marks, which cost more than their plain
                // forms on the demo targets' encodings
                Arguments.of("prompts/billing/high-bill-review.chat.json", 11, 516, "costly-character"),
                Arguments.of("prompts/billing/high-bill-review.chat.json", 11, 971, "costly-character"),
                Arguments.of("prompts/billing/high-bill-review.chat.json", 11, 744, "costly-character"),
                Arguments.of("prompts/outages/outage-report.chat.yaml", 8, 68, "costly-character"),
                Arguments.of("prompts/outages/outage-report.chat.yaml", 20, 7, "costly-character"),
                Arguments.of("prompts/outages/outage-report.chat.yaml", 24, 7, "costly-character"),
                Arguments.of("prompts/outages/outage-report.chat.yaml", 27, 7, "costly-character"),
                Arguments.of("prompts/outages/outage-report.chat.yaml", 45, 29, "costly-character"),
                // "Pasted safety preamble": one finding, at the first copy outside the partials folder
                Arguments.of("prompts/billing/explain-bill.md", 17, 1, "shared-block"),
                // "Cache-hostile prefix", "Budgets", "Variables"
                Arguments.of("prompts/system/assistant.md", 10, 10, "cache-order"),
                Arguments.of("prompts/billing/explain-bill.md", 2, 1, "over-budget"),
                Arguments.of("prompts/billing/explain-bill.md", 7, 0, "unused-variable"),
                Arguments.of("prompts/billing/payment-plan.chat.yaml", 0, 0, "unsized-variable"),
                Arguments.of("prompts/outages/outage-status.md", 0, 0, "unsized-variable"));
    }

    @ParameterizedTest(name = "{3} at {0}:{1}:{2}")
    @MethodSource("planted")
    void plantedWasteIsFound(String path, int line, int column, String rule) {
        boolean found = result.findings().stream().anyMatch(f -> f.path().equals(path) && f.rule().equals(rule)
                && (line == 0 || f.line() == line) && (column == 0 || f.column() == column));
        assertTrue(found, rule + " expected at " + path + ":" + line + ":" + column);
    }

    @ParameterizedTest
    @ValueSource(strings = {"prompts/system/after-hours.md", "prompts/meters/reread-confirmation.txt",
            "prompts/quality/boil-water-faq.chat.yaml", "prompts/agents/crew-handoff-summary.chat.yaml",
            "prompts/partials/brand-voice.md", "prompts/partials/escalation-policy.md",
            "prompts/partials/safety-preamble.md"})
    void cleanTemplatesHaveNoFinding(String path) {
        List<Finding> found = result.findings().stream().filter(f -> f.path().equals(path)).toList();
        assertEquals(List.of(), found);
    }

    @Test
    void arrowsAreFlaggedExactlyWhenSomeTargetsTokenizerChargesMoreForThem() {
        // The rule measures rather than listing characters: the four arrows of assistant.md line 80 cost
        // the same as '->' on o200k_base and cl100k_base but more on the laptop target's
        // small demo vocabulary, so whether they are flagged follows from the configured targets.
        String line;
        try {
            line = java.nio.file.Files.readAllLines(DEMO.resolve("prompts/system/assistant.md")).get(79);
        } catch (java.io.IOException e) {
            throw new java.io.UncheckedIOException(e);
        }
        String plain = line.replace("\u2192", "->");
        TokenizerRegistry registry = new TokenizerRegistry();
        boolean costlier = false;
        for (var target : dev.tare.config.ConfigLoader.load(DEMO.resolve("tare.yaml")).targets()) {
            var tokenizer = registry.get(target.tokenizer(), DEMO);
            costlier |= tokenizer.count(line) > tokenizer.count(plain);
        }
        boolean flagged = result.findings().stream().anyMatch(f -> f.path().equals("prompts/system/assistant.md")
                && f.line() == 80 && f.rule().equals("costly-character"));
        assertEquals(costlier, flagged);
    }

    @Test
    void thePastedPreambleIsOneFindingWithEveryOtherCopyRelated() {
        // WASTE.md, "Pasted safety preamble": seven pasted copies (two differing only in whitespace) and
        // the partial that holds the canonical text; the templates that include the partial hold no copy.
        List<Finding> shared = result.findings().stream().filter(f -> f.rule().equals("shared-block")).toList();
        assertEquals(1, shared.size(), shared.toString());
        assertEquals(List.of("prompts/billing/payment-plan.chat.yaml", "prompts/connections/new-service.md",
                        "prompts/leaks/leak-triage.md", "prompts/meters/reading-dispute.md", "prompts/outages/outage-status.md",
                        "prompts/partials/safety-preamble.md", "prompts/quality/quality-notice.md"),
                shared.get(0).related().stream().map(Related::path).toList());
        List<Integer> lines = shared.get(0).related().stream().map(Related::line).toList();
        assertEquals(List.of(14, 18, 14, 15, 16, 1, 16), lines);
    }

    @Test
    void theExcludedDraftIsNotChecked() {
        assertTrue(result.findings().stream().noneMatch(f -> f.path().contains("drafts/")));
    }

    @Test
    void theWithinBudgetTemplatesPass() {
        for (String path : List.of("prompts/system/assistant.md", "prompts/few-shot/intent-examples.md",
                "prompts/agents/field-crew-work-order.md")) {
            assertTrue(result.findings().stream().noneMatch(f -> f.path().equals(path) && f.rule().equals("over-budget")), path);
        }
    }

    @Test
    void onlyTheBudgetBreachIsAnErrorSoTheDefaultGateFails() {
        assertEquals(1, result.count(Severity.ERROR));
        assertTrue(result.failed());
    }

    @Test
    void theSameInputGivesTheSameFindings() {
        CheckResult again = new Check(Workspace.open(List.of(DEMO), Optional.empty()), new TokenizerRegistry())
                .run(CheckOptions.defaults());
        assertEquals(result.findings(), again.findings());
    }
}
