package dev.tare.rewrite;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * The checker that {@link PublicCorpusSafetyTest} trusts: each property it promises to watch is shown
 * failing on a small invented edit, and a fix made only of safe edits passes, so that a clean corpus run
 * means the checker looked rather than that it could not see.
 */
class SafeRewritePropertiesCheckerTest {

    private static List<String> violations(String before, String after) {
        return SafeRewriteProperties.check(before, after).stream().map(v -> v.line() + " " + v.property()).toList();
    }

    @Test
    void safeEditsBreakNoProperty() {
        String before = "# Meter  readings   \n\n\n\nAsk for the ad\u200Bjust\u00ADment date.\t\nThen\u00A0close.\n\n"
                + "```json\n{\n  \"intent\": \"billing\",\n  \"urgent\": false\n}\n```\n";
        String after = "# Meter readings\n\nAsk for the adjustment date.\nThen close.\n\n"
                + "```json\n{\"intent\":\"billing\",\"urgent\":false}\n```\n";
        assertEquals(List.of(), SafeRewriteProperties.check(before, after));
    }

    @Test
    void aDeletedWordIsReportedAtItsLine() {
        String before = "Greet the customer.\nDo not approve refunds.\nClose politely.\n";
        String after = "Greet the customer.\nDo approve refunds.\nClose politely.\n";
        List<SafeRewriteProperties.Violation> found = SafeRewriteProperties.check(before, after);
        assertEquals(List.of("2 words"), violations(before, after));
        assertEquals("'not' became nothing (line 2 after)", found.get(0).detail());
    }

    @Test
    void aDeletedLineIsReportedOnceAndTheLinesBelowItAreNotBlamed() {
        String before = "Input: my bill doubled\nOutput: billing\n  Input: no water since noon\nOutput: billing\n    Indented close.\n";
        String after = "Input: my bill doubled\nOutput: billing\n  Input: no water since noon\n    Indented close.\n";
        assertEquals(List.of("4 words"), violations(before, after));
    }

    @Test
    void aChangedCodeFenceIsReportedEvenWhenItsWordsAreKept() {
        String before = "Run this:\n\n```sh\necho  \"meter  ok\"\n```\n";
        String after = "Run this:\n\n```sh\necho \"meter ok\"\n```\n";
        assertEquals(List.of("3 fence"), violations(before, after));
    }

    @Test
    void aJsonBlockMayBeLaidOutAfreshButNotGiveADifferentValue() {
        String before = "Reply with:\n```json\n{\n  \"intent\": \"leak\",\n  \"urgent\": true\n}\n```\n";
        String relaid = "Reply with:\n```json\n{\"intent\":\"leak\",\"urgent\":true}\n```\n";
        String changed = "Reply with:\n```json\n{\"intent\":\"leak\",\"urgent\":false}\n```\n";
        assertEquals(List.of(), violations(before, relaid));
        assertEquals(List.of("2 fence", "3 words"), violations(before, changed));
    }

    @Test
    void aChangedIndentationIsReported() {
        String before = "Steps:\n  1. Read the meter.\n     Write down all five digits.\n";
        String after = "Steps:\n  1. Read the meter.\n  Write down all five digits.\n";
        assertEquals(List.of("3 indent"), violations(before, after));
    }

    @Test
    void aTabOfATabSeparatedBlockTurnedIntoASpaceIsReported() {
        String before = "zone\tpressure\tstatus\nnorth\t42\tok\nThe\tend.\n";
        String after = "zone\tpressure\tstatus\nnorth 42\tok\nThe\tend.\n";
        assertEquals(List.of("2 tabs"), violations(before, after));
    }

    @Test
    void aLoneTabBetweenWordsOfProseMayBecomeASpace() {
        String before = "Ask for the\taccount number.\n\nThen check the meter.\n";
        String after = "Ask for the account number.\n\nThen check the meter.\n";
        assertEquals(List.of(), violations(before, after));
    }

    @Test
    void aCollapsedAlignedRunIsReported() {
        String before = "Rate the pressure:\n1   2   3   4   5\nlow         high\n";
        String after = "Rate the pressure:\n1 2 3 4 5\nlow         high\n";
        assertEquals(List.of("2 align"), violations(before, after));
    }

    @Test
    void aChangedPlaceholderIsReportedEvenWhenItsWordsAreKept() {
        String before = "Hello {{  name }}, your meter is {{ meter_id }}.\n";
        String after = "Hello {{ name }}, your meter is {{ meter_id }}.\n";
        assertEquals(List.of("1 placeholder"), violations(before, after));
    }

    @Test
    void aChangedTableRowIsReportedButItsTrailingSpacesMayGo() {
        String before = "| zone  | status |   \n|-------|--------|\n| north | ok     |\n";
        String trimmed = "| zone  | status |\n|-------|--------|\n| north | ok     |\n";
        String squeezed = "| zone  | status |\n|-------|--------|\n| north | ok |\n";
        assertEquals(List.of(), violations(before, trimmed));
        assertEquals(List.of("3 table"), violations(before, squeezed));
    }
}
