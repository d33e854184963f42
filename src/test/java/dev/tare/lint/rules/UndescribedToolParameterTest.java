package dev.tare.lint.rules;

import static dev.tare.lint.RuleHarness.findings;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.tare.lint.Finding;
import dev.tare.lint.RewriteClass;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;

/** Parameters the model has to guess, reported on their own line of the tool file. */
class UndescribedToolParameterTest {
    private final UndescribedToolParameter rule = new UndescribedToolParameter();

    @Test
    void aParameterWithoutADescriptionIsReportedOnItsLine() {
        String text = "tools:\n  - name: lookup_account\n    description: Find an account.\n    parameters:\n"
                + "      type: object\n      properties:\n"
                + "        phone: {type: string}\n"
                + "        postcode: {type: string, description: 'Postcode on file, no spaces.'}\n";
        List<Finding> found = findings(rule, "tools/accounts.yaml", text, Map.of());
        assertEquals(1, found.size());
        assertEquals(7, found.get(0).line());
        assertEquals("parameter 'phone' of tool 'lookup_account' has no description", found.get(0).message());
        assertEquals(RewriteClass.NONE, found.get(0).rewriteClass());
    }

    @Test
    void nestedParametersAreNamedByTheirPath() {
        String text = "[{\"name\":\"book\",\"description\":\"Book a visit.\",\"parameters\":{\"type\":\"object\","
                + "\"properties\":{\"slot\":{\"type\":\"object\",\"description\":\"When.\","
                + "\"properties\":{\"day\":{\"type\":\"string\"}}}}}}]\n";
        List<Finding> found = findings(rule, "tools/book.json", text, Map.of());
        assertEquals(List.of("parameter 'slot.day' of tool 'book' has no description"),
                found.stream().map(Finding::message).toList());
    }

    @Test
    void describedParametersAndToolsWithoutParametersAreFine() {
        assertTrue(findings(rule, "tools/a.json", "[{\"name\":\"a\",\"description\":\"Find.\",\"parameters\":{\"type\":\"object\","
                + "\"properties\":{\"phone\":{\"type\":\"string\",\"description\":\"Digits only.\"}}}}]\n", Map.of()).isEmpty());
        assertTrue(findings(rule, "tools/a.json", "[{\"name\":\"a\",\"description\":\"Find.\"}]\n", Map.of()).isEmpty());
    }
}
