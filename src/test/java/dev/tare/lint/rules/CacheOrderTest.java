package dev.tare.lint.rules;

import static dev.tare.lint.RuleHarness.findings;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.tare.config.ConfigLoader;
import dev.tare.config.TareConfig;
import dev.tare.lint.Example;
import dev.tare.lint.Finding;
import dev.tare.lint.LintContext;
import dev.tare.lint.RewriteClass;
import dev.tare.lint.RuleHarness;
import dev.tare.template.IncludeResolver;
import dev.tare.template.PlaceholderSyntax;
import dev.tare.template.Renderer;
import dev.tare.template.Template;
import dev.tare.tokenize.Tokenizer;
import dev.tare.tokenize.TokenizerRegistry;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.Set;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** Per-call text ahead of a static part long enough to be cached; expected counts come from the tokenizer. */
class CacheOrderTest {
    private static final String STATIC = "Answer water billing questions briefly and politely. ".repeat(6);
    private static final Map<String, Integer> MINIMUM_32 = Map.of(Example.PREFIX_CACHE_MIN_TOKENS, 32);

    private final CacheOrder rule = new CacheOrder();
    private final Tokenizer o200k = new TokenizerRegistry().get("o200k_base", Path.of("."));

    @Test
    void aVariableAheadOfTheStaticPartBreaksThePrefixCache() {
        String text = "Today is {{ date }}.\n" + STATIC;
        List<Finding> found = findings(rule, "a.md", text, MINIMUM_32);
        assertEquals(1, found.size());
        assertEquals(10, found.get(0).column());
        int total = o200k.count(text.replace("{{ date }}", ""));
        assertTrue(found.get(0).message().contains("every call would start with the same " + total + " tokens"),
                found.get(0).message());
        assertEquals(RewriteClass.NONE, found.get(0).rewriteClass());
    }

    @Test
    void onAPricedTargetTheMessageSaysWhatMovingThePerCallPartsSaves(@TempDir Path dir) throws IOException {
        Files.writeString(dir.resolve("tare.yaml"), """
                targets:
                  - name: hosted
                    tokenizer: o200k_base
                    price: {input: 2.0, cached_input: 0.5, output: 8.0, currency: USD}
                    prefix_cache: {min_tokens: 32, ttl_seconds: 300}
                    calls_per_day: 86400
                """);
        TareConfig config = ConfigLoader.load(dir.resolve("tare.yaml"));
        String text = "Today is {{ date }}.\n" + STATIC;
        List<Finding> found = findings(rule, "a.md", text, config);
        assertEquals(1, found.size());
        // As written nothing is cached (the leading part is under the minimum); reordered, all T static
        // tokens are (steps of one), and one call a second keeps the entry warm (h = 1 − e^−300):
        // T × h × (2.0 − 0.5) / 1e6 × 86,400 × 30 a month.
        int total = o200k.count(text.replace("{{ date }}", ""));
        int now = o200k.count("Today is ");
        double hit = 1 - Math.exp(-300);
        double saving = total * hit * 1.5 / 1e6 * 86_400 * 30;
        assertTrue(now < 32, "the leading part is under the minimum, so nothing is cached now");
        assertTrue(found.get(0).message().contains(String.format(java.util.Locale.ROOT,
                "saving about hosted USD %,.2f a month at this template's traffic", saving)), found.get(0).message());
    }

    @Test
    void theToolsSentWithTheTemplateOpenItsPrefixAsTheScanCountsThem(@TempDir Path dir) throws IOException {
        Files.writeString(dir.resolve("tare.yaml"), """
                targets:
                  - name: hosted
                    tokenizer: o200k_base
                    tool_overhead_tokens: 7
                    price: {input: 2.0, cached_input: 0.5, output: 8.0, currency: USD}
                    prefix_cache: {min_tokens: 64, ttl_seconds: 300}
                    calls_per_day: 86400
                """);
        TareConfig config = ConfigLoader.load(dir.resolve("tare.yaml"));
        String lookup = "{\"name\":\"lookup_account\",\"description\":\"Find an account.\"}";
        Template tools = RuleHarness.template("tools/accounts.json", "[" + lookup + "]\n");
        Template template = RuleHarness.template("prompts/a.md",
                "---\ntools: [tools/accounts.json]\n---\nToday is {{ date }}.\n" + STATIC + STATIC);
        LintContext context = new LintContext(config, new TokenizerRegistry(), new Renderer(IncludeResolver.NONE),
                List.of(template, tools), Set.of(), Map.of());
        List<Finding> found = rule.check(template, context);
        assertEquals(1, found.size());
        // Providers read tool definitions before the messages (prompt-caching documentation of the
        // hosted providers): reordered, the cached prefix is the tool (its minified JSON plus the
        // target's 7 framing tokens) and then every static token of the text.
        int tool = o200k.count(lookup) + 7;
        int total = o200k.count("Today is .\n" + STATIC + STATIC);
        assertTrue(tool + o200k.count("Today is ") < 64, "nothing is cached as written");
        double saving = (tool + total) * (1 - Math.exp(-300)) * 1.5 / 1e6 * 86_400 * 30;
        assertTrue(found.get(0).message().contains(String.format(java.util.Locale.ROOT,
                "saving about hosted USD %,.2f a month", saving)), found.get(0).message());
    }

    @Test
    void aFunctionCallAheadOfTheStaticPartBreaksThePrefixCacheToo() {
        String text = "Today is {{time.today}}, in {{$city}}.\n" + STATIC;
        List<Finding> found = findings(rule, PlaceholderSyntax.DOLLAR_DOUBLE_BRACE, "a.md", text, MINIMUM_32);
        assertEquals(1, found.size());
        assertEquals(10, found.get(0).column());
        int total = o200k.count(text.replace("{{time.today}}", "").replace("{{$city}}", ""));
        assertTrue(found.get(0).message().startsWith("'{{time.today}}' comes after only " + o200k.count("Today is ")
                + " leading static tokens"), found.get(0).message());
        assertTrue(found.get(0).message().contains("(1 variable and 1 call)"), found.get(0).message());
        assertTrue(found.get(0).message().contains("every call would start with the same " + total + " tokens"),
                found.get(0).message());
        assertEquals("more per-call text: {{$city}}", found.get(0).related().get(0).message());
    }

    @Test
    void laterPerCallTextIsRelated() {
        String text = "Today is {{ date }} and the caller is {{ name }}.\n" + STATIC;
        List<Finding> found = findings(rule, "a.md", text, MINIMUM_32);
        assertEquals(1, found.size());
        assertTrue(found.get(0).message().contains("(2 variables)"), found.get(0).message());
        assertEquals(1, found.get(0).related().size());
        assertEquals("more per-call text: {{ name }}", found.get(0).related().get(0).message());
        assertEquals(39, found.get(0).related().get(0).column());
    }

    @Test
    void aVariableInsideAnIncludeAheadOfTheStaticPartCountsAsTheScanCountsIt() {
        // The scan's cached tokens stop at the first variable wherever it stands, includes pasted in
        // (overlap.LeadingText); the rule measures the same leading text, so a greeting partial with a
        // name in it breaks the prefix even though the template's own first variable comes last.
        String body = "{{> greeting }}\n" + STATIC + "\nToday is {{ date }}.\n";
        Template partial = RuleHarness.template("prompts/partials/greeting.md", "Hello {{ name }}.\n");
        Template template = RuleHarness.template("prompts/a.md", body);
        List<Finding> found = rule.check(template, RuleHarness.withPartials(List.of(template, partial), MINIMUM_32));
        assertEquals(1, found.size());
        assertEquals(1, found.get(0).column());
        assertTrue(found.get(0).message().startsWith("'{{> greeting }}' brings in per-call text after only "
                + o200k.count("Hello ") + " leading static tokens"), found.get(0).message());
    }

    @Test
    void aVariableAfterTheStaticPartOrAShortTemplateIsFine() {
        String late = STATIC + "\nToday is {{ date }}.\n";
        assertTrue(findings(rule, "a.md", late, MINIMUM_32).isEmpty());
        assertTrue(findings(rule, "a.md", "Hi {{ name }}.\n", MINIMUM_32).isEmpty());
    }

    @Test
    void aPartialIsJudgedOnlyWhereItIsIncluded() {
        String text = "Today is {{ date }}.\n" + STATIC;
        assertTrue(findings(rule, "prompts/partials/intro.md", text, MINIMUM_32).isEmpty());
    }
}
