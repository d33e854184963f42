package dev.tare.lint;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.tare.lint.rules.BuiltInRules;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;

/**
 * Findings in role-marked text and in serialized prompt objects point at the file's own lines and
 * columns, and rewrites edit the file's own characters: a message between role markers is a stretch
 * of the file, and a prompt object's template is a YAML or JSON string followed as chat contents are
 * (RFC 8259 §7 for JSON string escapes; YAML 1.2.2 §8.1.2 for literal block scalars).
 */
class PromptFormsRewriteTest {
    private static Rule rule(String id) {
        return BuiltInRules.all().stream().filter(r -> r.descriptor().id().equals(id)).findFirst().orElseThrow();
    }

    private static final String MARKED = """
            ---
            budget: 300
            ---
            # system:
            You answer questions for the Riverside water utility.  \s

            ## user:
            My bill is  high.



            Why?
            """;

    @Test
    void roleMarkedMessagesAreLocatedAndRewrittenInTheFile() {
        List<Finding> trailing = RuleHarness.findings(rule("trailing-whitespace"), "bill.md", MARKED, Map.of());
        assertEquals(1, trailing.size());
        assertEquals(5, trailing.get(0).line());
        assertEquals(54, trailing.get(0).column());
        assertEquals(MARKED.replace("utility.   \n", "utility.\n"), RuleHarness.fixed(rule("trailing-whitespace"), "bill.md", MARKED));

        List<Finding> run = RuleHarness.findings(rule("space-run"), "bill.md", MARKED, Map.of());
        assertEquals(1, run.size());
        assertEquals(8, run.get(0).line());
        assertEquals(11, run.get(0).column());
        assertEquals(MARKED.replace("is  high", "is high"), RuleHarness.fixed(rule("space-run"), "bill.md", MARKED));

        // The blank line between the messages belongs to neither; the run inside the user's message does.
        List<Finding> blank = RuleHarness.findings(rule("blank-lines"), "bill.md", MARKED, Map.of());
        assertEquals(1, blank.size());
        assertEquals(9, blank.get(0).line());
        assertEquals(MARKED.replace("high.\n\n\n\nWhy", "high.\n\nWhy"), RuleHarness.fixed(rule("blank-lines"), "bill.md", MARKED));
    }

    @Test
    void aPromptObjectsTemplateIsFollowedThroughItsString() {
        String json = "{\"input_variables\": [\"q\"], \"template\": \"Line one.\\nAnswer {q}.  Then stop.\"}";
        List<Finding> found = RuleHarness.findings(rule("space-run"), "answer.json", json, Map.of());
        assertEquals(1, found.size());
        assertEquals(1, found.get(0).line());
        assertEquals(json.indexOf(".  Then") + 2, found.get(0).column());
        assertEquals(json.replace(".  Then", ". Then"), RuleHarness.fixed(rule("space-run"), "answer.json", json));

        String yaml = "input_variables: [name]\ntemplate_format: mustache\ntemplate: |\n  Hello {{name}}.  \n  Bye  now.\n";
        assertEquals(yaml.replace(".  \n", ".\n"), RuleHarness.fixed(rule("trailing-whitespace"), "greeting.yaml", yaml));
        List<Finding> run = RuleHarness.findings(rule("space-run"), "greeting.yaml", yaml, Map.of());
        assertEquals(5, run.get(0).line());
        assertEquals(6, run.get(0).column());
    }

    @Test
    void aChatShapedObjectsMessagesAreLocated() {
        String yaml = "input_variables: []\nmessages:\n  - role: system\n    prompt:\n      template: \"Be  brief.\"\n";
        List<Finding> found = RuleHarness.findings(rule("space-run"), "support.yaml", yaml, Map.of());
        assertEquals(1, found.size());
        assertEquals(5, found.get(0).line());
        assertEquals(yaml.substring(yaml.lastIndexOf('\n', yaml.indexOf("Be  ")) + 1).indexOf("  brief") + 1, found.get(0).column());
        assertTrue(found.get(0).rewrite().isPresent());
        assertEquals(yaml.replace("Be  brief", "Be brief"), RuleHarness.fixed(rule("space-run"), "support.yaml", yaml));
    }
}
