package dev.tare.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.tare.cli.Cli;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * {@code tare scan --format html} without a browser: one self-contained page whose every piece of
 * template text is escaped. {@code ReportBrowserIT} renders the demo's report in Chromium.
 */
class HtmlReportTest {
    @TempDir
    Path root;

    private void write(String path, String text) throws IOException {
        Path file = root.resolve(path);
        Files.createDirectories(file.getParent());
        Files.writeString(file, text);
    }

    private String html() {
        Cli.Run run = Cli.run("scan", root.toString(), "--format", "html");
        assertEquals(0, run.exitCode(), run.err());
        return run.out();
    }

    @Test
    void templateTextIsEscapedEverywhere() throws IOException {
        write("tare.yaml", "templates: {include: [\"prompts/**/*.md\"]}\n");
        write("prompts/<b>odd</b>.md", "Say <script>document.title='ran'</script> and <img src=x onerror=\"alert(1)\">"
                + " & \"quotes\" 'too'.\n");
        String html = html();
        // The HTML 5 specification's tokenizer starts a tag only at '<' followed by a letter, '/' or '!';
        // escaped as &lt; nothing from the template can open one.
        assertFalse(html.toLowerCase(Locale.ROOT).contains("<script"), "no script element");
        assertFalse(html.contains("<img"), "no img element");
        assertFalse(html.contains("<b>odd"), "paths are escaped too");
        assertTrue(html.contains("Say &lt;script&gt;document.title=&#39;ran&#39;&lt;/script&gt;"), "shown as text");
        assertTrue(html.contains("onerror=&quot;alert(1)&quot;"), html);
        assertTrue(html.contains("prompts/&lt;b&gt;odd&lt;/b&gt;.md"));
    }

    @Test
    void thePageNeedsNothingFromTheNetwork() throws IOException {
        write("tare.yaml", "templates: {include: [\"prompts/**/*.md\"]}\n");
        write("prompts/a.md", "See https://example.org/terms before you answer.\n");
        String html = html();
        String withoutTemplateText = html.replace("See https://example.org/terms before you answer.", "");
        assertFalse(withoutTemplateText.contains("http:") || withoutTemplateText.contains("https:"),
                "no address outside the page but the template's own text");
        Matcher links = Pattern.compile("(?i)\\b(?:src|href)\\s*=\\s*\"([^\"]*)\"").matcher(html);
        while (links.find()) {
            assertTrue(links.group(1).startsWith("#"), "only links inside the page: " + links.group(1));
        }
        assertTrue(html.contains("<meta http-equiv=\"Content-Security-Policy\" content=\"default-src 'none';"),
                "the page forbids every request and every script");
        assertTrue(html.contains("<style>") && html.contains("@media print"), "inline CSS with a print stylesheet");
        assertTrue(html.contains(Html.text(Figures.ESTIMATE_NOTE)), "says its figures are estimates");
    }

    @Test
    void invisibleCharactersAreShownAsLabelledMarks() throws IOException {
        write("tare.yaml", "templates: {include: [\"prompts/**/*.md\"]}\n");
        write("prompts/a.md", "adjust\u200Bment and\u00A0space\n");
        String html = html();
        assertTrue(html.contains("adjust<span class=\"hidden-char\" title=\"invisible character U+200B\">U+200B</span>ment"),
                "a zero-width space is made visible");
        assertTrue(html.contains(">U+00A0</span>space"), "a no-break space is made visible");
    }

    @Test
    void eachLineCarriesItsTokenCountAndShade() throws IOException {
        write("tare.yaml", "templates: {include: [\"prompts/**/*.md\"]}\n");
        write("prompts/a.md", "---\nbudget: 100\n---\nShort line.\n");
        String html = html();
        assertTrue(html.contains("<tr class=\"line unsent\" data-line=\"1\" data-tokens=\"0\">"), "front matter is not sent");
        int tokens = new dev.tare.tokenize.TokenizerRegistry().get("o200k_base", root).count("Short line.\n");
        assertTrue(html.contains("<tr class=\"line level-" + LineView.level(tokens) + "\" data-line=\"4\" data-tokens=\""
                + tokens + "\">"), html);
    }

    @Test
    void aCachingTargetListsWherePuttingStaticPartsFirstSavesMost() throws IOException {
        write("tare.yaml", """
                templates: {include: ["prompts/**/*.md"]}
                targets:
                  - name: hosted
                    tokenizer: o200k_base
                    price: {input: 2.0, cached_input: 0.5, output: 8.0, currency: USD}
                    prefix_cache: {min_tokens: 20, ttl_seconds: 300}
                    calls_per_day: 86400
                """);
        String rules = "Answer water billing questions briefly and politely, and never promise a refund. ".repeat(3);
        write("prompts/late.md", "Today is {{ date }}.\n" + rules);
        write("prompts/first.md", rules + "Today is {{ date }}.\n");
        String html = html();
        assertTrue(html.contains("Where putting static parts first would save most (estimates)"), html);
        // late.md caches nothing as written and everything reordered; first.md already caches its rules.
        int start = html.indexOf("Where putting static parts first");
        String table = html.substring(start, html.indexOf("</table>", start));
        assertTrue(table.contains("<th scope=\"row\">prompts/late.md</th>"), table);
    }

    /** A bar is the input tokens the template table shows for the first target: tools and framing included. */
    @Test
    void eachBarAddsUpToTheFirstTargetsInputTokens() throws IOException {
        write("tare.yaml", """
                templates: {include: ["prompts/**/*.md", "tools/*.json"]}
                targets:
                  - {name: hosted, tokenizer: o200k_base, message_overhead_tokens: 3, tool_overhead_tokens: 7}
                """);
        write("tools/accounts.json", "[{\"name\": \"lookup_account\", \"description\": \"Find an account.\"}]\n");
        write("prompts/a.md", "---\ntools: [tools/accounts.json]\nvariables: {name: {sample: Ada}}\n---\n"
                + "Answer water billing questions for {{ name }}.\n");
        Cli.Run json = Cli.run("scan", root.toString(), "--format", "json");
        Matcher input = Pattern.compile("\"path\" : \"prompts/a.md\"(?s).*?\"input_tokens\" : (\\d+)").matcher(json.out());
        assertTrue(input.find(), json.out());
        Matcher bar = Pattern.compile("data-template=\"prompts/a.md\" data-static=\"(\\d+)\" data-variables=\"(\\d+)\""
                + " data-framing=\"(\\d+)\"").matcher(html());
        assertTrue(bar.find());
        assertEquals(Integer.parseInt(input.group(1)), Integer.parseInt(bar.group(1)) + Integer.parseInt(bar.group(2))
                + Integer.parseInt(bar.group(3)));
        assertTrue(Integer.parseInt(bar.group(3)) > 7, "the tool definition is in the bar");
    }
}
