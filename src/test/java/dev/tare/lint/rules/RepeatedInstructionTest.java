package dev.tare.lint.rules;

import static dev.tare.lint.RuleHarness.findings;
import static dev.tare.lint.RuleHarness.fixed;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.tare.lint.Finding;
import dev.tare.lint.RewriteClass;
import java.util.List;
import org.junit.jupiter.api.Test;

/** Sentences repeated word for word within one message; near repeats are {@link NearDuplicateInstructionTest}'s. */
class RepeatedInstructionTest {
    private final RepeatedInstruction exact = new RepeatedInstruction();

    @Test
    void theLaterCopyOfARepeatedSentenceIsDroppedWithItsParagraph() {
        String text = "Greet them. Ask whether the water is clear or discoloured.\n\nCheck the meter.\n\n"
                + "Ask whether the water is clear or discoloured.\n\nClose politely.\n";
        List<Finding> found = findings(exact, text);
        assertEquals(1, found.size());
        assertEquals(5, found.get(0).line());
        assertEquals(1, found.get(0).related().get(0).line());
        assertEquals("Greet them. Ask whether the water is clear or discoloured.\n\nCheck the meter.\n\nClose politely.\n",
                fixed(exact, text));
    }

    @Test
    void aLastParagraphWithoutALineBreakIsDroppedWithTheBreakBeforeIt() {
        String sentence = "Always confirm the account number before you continue.";
        assertEquals(sentence + "\nwater", fixed(exact, sentence + "\nwater\n\n" + sentence));
        assertEquals(sentence + "\r\n# Notes", fixed(exact, sentence + "\r\n# Notes\r\n" + sentence));
        String afterFence = sentence + "\n```\necho hi\n```\n" + sentence;
        assertEquals(1, findings(exact, afterFence).size());
        assertEquals(afterFence, fixed(exact, afterFence), "the break before belongs to the fence, so no rewrite is offered");
    }

    @Test
    void aRepeatInsideAParagraphIsCutWithTheSpaceBeforeIt() {
        String text = "Keep every answer short and plain. Use the account notes. Keep every answer short and plain.\n";
        assertEquals("Keep every answer short and plain. Use the account notes.\n", fixed(exact, text));
    }

    @Test
    void repeatsInListsOrWithPlaceholdersAreFlaggedWithoutARewrite() {
        String list = "- Never read out a full account number.\n- Check the meter.\n- Never read out a full account number.\n";
        List<Finding> found = findings(exact, list);
        assertEquals(1, found.size());
        assertTrue(found.get(0).rewrite().isEmpty());
        String variable = "Greet {{ name }} by their first name.\n\nGreet {{ name }} by their first name.\n";
        assertTrue(findings(exact, variable).get(0).rewrite().isEmpty());
    }

    @Test
    void shortPhrasesAndCodeAreNotRepeatedInstructions() {
        assertTrue(findings(exact, "Thank you.\n\nThank you.\n").isEmpty());
        assertTrue(findings(exact, "```\nprint the full bill now\n```\n```\nprint the full bill now\n```\n").isEmpty());
    }

    @Test
    void droppingACopyIsAReviewRewrite() {
        assertEquals(RewriteClass.REVIEW, RepeatedInstruction.DESCRIPTOR.rewriteClass());
        assertEquals(java.util.Optional.of(dev.tare.lint.EditKind.TEXT), RepeatedInstruction.DESCRIPTOR.editKind());
    }

    @Test
    void linesOfExamplesDialogueHeadingsAndSectionsAreNotInstructions() {
        String examples = "Classify the message.\n\nInput: my bill doubled this month\nOutput: billing question asked\n\n"
                + "Input: my tap water is brown\nOutput: billing question asked\n";
        assertTrue(findings(exact, examples).isEmpty(), "an example's line repeats in the next example");
        String dialogue = "Anna: Is the meter outside the house?\nBen: I will check it now.\nAnna: Is the meter outside the house?\n";
        assertTrue(findings(exact, dialogue).isEmpty(), "a transcript repeats what was said");
        String headings = "# Leaks\n\n## Steps to take now\n\nCall.\n\n# Bills\n\n## Steps to take now\n\nPay.\n";
        assertTrue(findings(exact, headings).isEmpty(), "a heading repeated once per section");
        String tagged = "<first>\nRead the account notes first.\n</first>\n<second>\nRead the account notes first.\n</second>\n";
        assertTrue(findings(exact, tagged).isEmpty());
        String pointing = "Rule one: be brief.\n\nThe above rule matches both examples below:\n\nRule two: be kind.\n\n"
                + "The above rule matches both examples below:\n";
        assertTrue(findings(exact, pointing).isEmpty(), "a sentence that points at its neighbours says something else each time");
    }

    @Test
    void copiesInDifferentBranchesOrMessagesAreNotRepeats() {
        String branches = "Offer the payment plan to this customer.\n\n{% if premium %}\nOffer the payment plan to this customer.\n{% endif %}\n";
        assertTrue(findings(exact, branches).isEmpty(), "the copy inside the branch is sent only with it");
        String chat = "messages:\n  - role: system\n    content: Always confirm the street address first.\n"
                + "  - role: user\n    content: Always confirm the street address first.\n";
        assertTrue(findings(exact, "a.chat.yaml", chat, java.util.Map.of()).isEmpty(), "each message is read on its own");
        String same = "Offer the payment plan to this customer.\n\nOffer the payment plan to this customer.\n";
        assertEquals(1, findings(exact, same).size(), "the same sentence twice in one message is a repeat");
    }
}
