package dev.tare.rewrite;

import static org.junit.jupiter.api.Assertions.assertEquals;

import dev.tare.source.SourceText;
import dev.tare.template.PlaceholderSyntax;
import dev.tare.template.Template;
import dev.tare.template.TemplateParser;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;

/** The promise of a safe rewrite keeps every placeholder as written, function calls included. */
class SafePromiseTest {
    private static Template parse(String text) {
        return new TemplateParser(PlaceholderSyntax.DOLLAR_DOUBLE_BRACE)
                .parse(new SourceText("a.md", Path.of("a.md"), text, false, text.length()), false);
    }

    @Test
    void whitespaceBetweenWordsMayChangeButNotInsideAFunctionCall() {
        String before = "Check  the meter. {{meter.read  $account}} {{$name}}\n";
        assertEquals(List.of(), SafePromise.broken(parse(before), parse(before.replace("Check  the", "Check the"))));
        assertEquals(List.of("the variables, calls, includes or tags of the text changed"),
                SafePromise.broken(parse(before), parse(before.replace("read  $account", "read $account"))));
    }
}
