package dev.tare.lint.rules;

import static dev.tare.lint.RuleHarness.findings;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.tare.lint.Finding;
import dev.tare.lint.RewriteClass;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;

/** Sentences said twice across tool definitions, each of which goes out with every call. */
class RepeatedToolDescriptionTest {
    private final RepeatedToolDescription rule = new RepeatedToolDescription();

    @Test
    void aSentenceInTwoToolsIsReportedAtTheSecond() {
        String text = "[\n  {\"name\": \"lookup_account\", \"description\": \"Find an account. Always confirm the customer's name first.\"},\n"
                + "  {\"name\": \"close_account\", \"description\": \"Close an account. Always  confirm the customer's name first.\"}\n]\n";
        List<Finding> found = findings(rule, "tools/accounts.json", text, Map.of());
        assertEquals(1, found.size());
        assertEquals(3, found.get(0).line());
        assertEquals("tool 'close_account' repeats \"Always  confirm the customer's name first.\" from tool 'lookup_account'",
                found.get(0).message());
        assertEquals(RewriteClass.NONE, found.get(0).rewriteClass());
    }

    @Test
    void aParameterThatOnlyRepeatsItsToolIsReportedOnItsLine() {
        String text = "tools:\n  - name: lookup_account\n    description: Find the account of the caller by phone.\n"
                + "    parameters:\n      type: object\n      properties:\n"
                + "        phone: {type: string, description: find the account of the caller}\n";
        List<Finding> found = findings(rule, "tools/accounts.yaml", text, Map.of());
        assertEquals(1, found.size());
        assertEquals(7, found.get(0).line());
        assertEquals("parameter 'phone' of tool 'lookup_account' only repeats the tool's description", found.get(0).message());
    }

    @Test
    void shortSentencesAndRepeatsWithinOneToolAreNotReported() {
        String shortOnes = "[{\"name\":\"a\",\"description\":\"Required.\"},{\"name\":\"b\",\"description\":\"Required.\"}]\n";
        assertTrue(findings(rule, "tools/a.json", shortOnes, Map.of()).isEmpty(), "too generic to be a repeat");
        String withinOne = "[{\"name\":\"a\",\"description\":\"Check the meter reading. Check the meter reading.\"}]\n";
        assertTrue(findings(rule, "tools/a.json", withinOne, Map.of()).isEmpty());
    }
}
