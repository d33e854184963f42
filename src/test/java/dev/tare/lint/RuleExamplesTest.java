package dev.tare.lint;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assertions.fail;

import dev.tare.config.TareConfig;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.stream.Stream;
import org.junit.jupiter.api.DynamicTest;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.TestFactory;

/**
 * Every worked example of every rule (built-in descriptors and the packs under {@code rules/}) runs
 * as a test: the same examples {@code tare explain} shows and {@code tare rules test} runs.
 */
class RuleExamplesTest {
    private static final Path PROJECT = Path.of(System.getProperty("tare.project.dir", "."));

    @TestFactory
    Stream<DynamicTest> everyExampleBehavesAsWritten() {
        RuleCatalog catalog = dev.tare.app.RulePacks.catalog(TareConfig.defaults(PROJECT));
        List<DynamicTest> tests = new ArrayList<>();
        for (Rule rule : catalog.all()) {
            List<Example> examples = rule.descriptor().examples();
            for (int i = 0; i < examples.size(); i++) {
                Example example = examples.get(i);
                tests.add(DynamicTest.dynamicTest(rule.descriptor().id() + " example " + (i + 1), () -> {
                    Optional<String> problem = ExampleRunner.run(rule, example, catalog.ids());
                    if (problem.isPresent()) {
                        fail(problem.get());
                    }
                }));
            }
        }
        return tests.stream();
    }

    @Test
    void theDemoHousePackExamplesRunToo() {
        RuleCatalog catalog = dev.tare.app.RulePacks.catalog(dev.tare.config.ConfigLoader.load(PROJECT.resolve("corpora/demo/tare.yaml")));
        List<ExampleRunner.Outcome> outcomes = ExampleRunner.runAll(catalog);
        assertTrue(outcomes.stream().anyMatch(o -> o.rule().equals("repeated-punctuation")));
        assertTrue(outcomes.stream().allMatch(ExampleRunner.Outcome::passed), outcomes.toString());
    }

    @Test
    void aBrokenExampleIsReportedNotPassed() {
        Rule rule = dev.tare.app.RulePacks.catalog(TareConfig.defaults(PROJECT)).rule("trailing-whitespace");
        Optional<String> problem = ExampleRunner.run(rule, Example.of("Be brief.  \n", "Be brief. \n"), java.util.Set.of());
        assertTrue(problem.isPresent());
        assertTrue(problem.get().startsWith("its rewrites give"), problem.get());
        assertEquals(Optional.of("flags nothing in 'before'"),
                ExampleRunner.run(rule, Example.of("Clean.\n", "Clean.\n"), java.util.Set.of()));
    }
}
