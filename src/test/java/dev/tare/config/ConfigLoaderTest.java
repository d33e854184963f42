package dev.tare.config;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.tare.TareException;
import dev.tare.footprint.PrefixCache;
import dev.tare.footprint.Target;
import dev.tare.template.PlaceholderSyntax;
import dev.tare.template.RoleMarkers;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.OptionalDouble;
import java.util.OptionalInt;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class ConfigLoaderTest {
    @TempDir
    Path dir;

    private TareConfig load(String yaml) throws IOException {
        return ConfigLoader.load(Files.writeString(dir.resolve("tare.yaml"), yaml));
    }

    private String problem(String yaml) throws IOException {
        Path file = Files.writeString(dir.resolve("tare.yaml"), yaml);
        return assertThrows(TareException.class, () -> ConfigLoader.load(file)).getMessage();
    }

    @Test
    void roleMarkersAreOnUnlessTurnedOff() throws IOException {
        assertEquals(RoleMarkers.AUTO, load("templates: {include: [\"*.md\"]}\n").templates().roles());
        assertEquals(RoleMarkers.AUTO, load("templates: {roles: auto}\n").templates().roles());
        assertEquals(RoleMarkers.OFF, load("templates: {roles: \"off\"}\n").templates().roles());
        assertEquals(RoleMarkers.OFF, load("templates: {roles: off}\n").templates().roles(), "YAML 1.1 reads a bare off as false");
        assertTrue(problem("templates: {roles: always}\n").endsWith(
                "tare.yaml, line 1: templates.roles: unknown roles setting 'always': use one of auto, off"));
    }

    @Test
    void readsEverySection() throws IOException {
        TareConfig config = load("""
                templates:
                  include: ["prompts/**/*.md"]
                  exclude: ["**/drafts/**"]
                  placeholder: single-brace
                  partials: prompts/partials/
                  max_file_bytes: 4096
                targets:
                  - name: hosted
                    tokenizer: o200k_base
                    price: {input: 2.0, cached_input: 0.5, cache_write: 2.5, output: 8.0}
                    prefix_cache: {min_tokens: 1024, step_tokens: 128, ttl_seconds: 600}
                    message_overhead_tokens: 4
                    reply_overhead_tokens: 3
                    calls_per_day: 20000
                    output_tokens: 300
                budgets: {default: 2000, "prompts/agents/**": 6000}
                baseline: {file: base.json, tolerance_percent: 2.5}
                rules: {disable: [a], severity: {b: warning}, packs: [rules, more]}
                hook: {fix: true}
                """);
        assertEquals(PlaceholderSyntax.SINGLE_BRACE, config.templates().placeholder());
        assertEquals("prompts/partials", config.templates().partials());
        assertEquals(4096, config.templates().maxFileBytes());
        Target hosted = config.target("hosted");
        assertEquals(4, hosted.messageOverheadTokens());
        assertEquals(0.5, hosted.price().orElseThrow().cachedInputPerMillion().getAsDouble());
        assertEquals("USD", hosted.price().orElseThrow().currency());
        assertEquals(2.5, hosted.price().orElseThrow().cacheWrite());
        assertEquals(new PrefixCache(1024, 128, OptionalDouble.of(600)), hosted.prefixCache().orElseThrow());
        assertEquals(OptionalInt.of(6000), config.budgets().budgetFor("prompts/agents/x/y.md"));
        assertEquals(OptionalInt.of(2000), config.budgets().budgetFor("prompts/a.md"));
        assertEquals(2.5, config.baseline().tolerancePercent());
        assertEquals(List.of("rules", "more"), config.rules().packs());
        assertTrue(config.hookFix());
        assertEquals(dir.toAbsolutePath().normalize(), config.root());
    }

    @Test
    void anEmptyFileMeansDefaults() throws IOException {
        TareConfig config = load("# nothing yet\n");
        assertEquals(TemplatesConfig.DEFAULT_INCLUDE, config.templates().include());
        assertEquals(List.of(), config.targets());
    }

    @Test
    void unknownKeysNameTheLineAndTheNearestKnownKey() throws IOException {
        assertEquals("tare.yaml, line 2: templates.placholder: unknown key; did you mean 'placeholder'?",
                problem("templates:\n  placholder: none\n").replace(dir.resolve("tare.yaml").toString(), "tare.yaml"));
        assertTrue(problem("colours: 3\n").contains("known keys here: baseline, budgets, hook, rules, targets, templates"));
    }

    @Test
    void badValuesNameTheKeyAndWhatIsAccepted() throws IOException {
        assertTrue(problem("templates: {placeholder: curly}\n").contains("templates.placeholder: unknown placeholder syntax 'curly'"));
        assertTrue(problem("templates: {include: [\"a[b\"]}\n").contains("templates.include[0]"));
        assertTrue(problem("targets:\n  - name: a\n").contains("target 'a' names no tokenizer"));
        assertTrue(problem("targets:\n  - {name: a, tokenizer: o200k_base}\n  - {name: a, tokenizer: cl100k_base}\n")
                .contains("line 3: targets[1].name: target 'a' is configured twice"));
        assertTrue(problem("targets:\n  - {name: a, tokenizer: o200k_base, price: {input: -1, output: 1}}\n")
                .contains("targets[0].price.input: must be a number of at least 0"));
        assertTrue(problem("budgets: {default: many}\n").contains("budgets.default: must be a whole number"));
        assertTrue(problem("templates: {partials: ../elsewhere}\n").contains("must be a folder inside the repository"));
        assertTrue(problem("hook: {fix: maybe}\n").contains("hook.fix: must be true or false"));
        assertTrue(problem("targets:\n  - name: a\n    tokenizer: o200k\n").contains("line 3: targets[0].tokenizer:"
                + " unknown tokenizer 'o200k'; did you mean 'o200k_base'?"));
        assertTrue(problem("targets:\n  - name: a\n    tokenizer: o200k_base\n"
                + "    price: {input: 2.5, cached_input: 0.25, cache_write: 0.1, output: 10}\n")
                .contains("line 4: targets[0].price.cache_write: must be at least the cached_input price (0.25)"));
    }

    @Test
    void prefixCachesOfBothKinds() throws IOException {
        Target hosted = load("targets:\n  - {name: a, tokenizer: o200k_base, prefix_cache: {min_tokens: 1024}}\n").target("a");
        // Steps of one token and a five-minute entry unless said otherwise.
        assertEquals(new PrefixCache(1024, 1, OptionalDouble.of(300)), hosted.prefixCache().orElseThrow());
        Target server = load("targets:\n  - {name: a, tokenizer: o200k_base, prefix_cache: {block_tokens: 16}}\n").target("a");
        assertEquals(PrefixCache.blocks(16), server.prefixCache().orElseThrow());
        // Without a cache_write price, writes cost the input price.
        Target plain = load("targets:\n  - {name: a, tokenizer: o200k_base, price: {input: 2, output: 8}}\n").target("a");
        assertEquals(2.0, plain.price().orElseThrow().cacheWrite());
    }

    @Test
    void trafficGlobsTakeTheFirstMatch() throws IOException {
        TareConfig config = load("traffic: {\"prompts/support/**\": 30000, \"prompts/**\": 500}\n");
        assertEquals(OptionalDouble.of(30000), config.traffic().callsPerDay("prompts/support/a.md"));
        assertEquals(OptionalDouble.of(500), config.traffic().callsPerDay("prompts/b.md"));
        assertEquals(OptionalDouble.empty(), config.traffic().callsPerDay("other/c.md"));
        assertTrue(problem("traffic: {\"a[b\": 5}\n").contains("traffic.a[b"));
        assertTrue(problem("traffic: {\"prompts/**\": -5}\n").contains("traffic.prompts/**"));
    }

    @Test
    void prefixCacheMistakesNameTheKey() throws IOException {
        String old = problem("targets:\n  - name: a\n    tokenizer: o200k_base\n    prefix_cache_min_tokens: 1024\n");
        assertTrue(old.contains("targets[0].prefix_cache_min_tokens: is replaced by prefix_cache: {min_tokens: N"), old);
        assertTrue(old.contains("line 4"), old);
        assertTrue(problem("targets:\n  - {name: a, tokenizer: o200k_base, prefix_cache: {block_tokens: 16, min_tokens: 8}}\n")
                .contains("keep one kind"));
        assertTrue(problem("targets:\n  - {name: a, tokenizer: o200k_base, prefix_cache: {ttl_seconds: 60}}\n")
                .contains("names no min_tokens"));
        assertTrue(problem("targets:\n  - {name: a, tokenizer: o200k_base, prefix_cache: {min_tokens: 0}}\n")
                .contains("prefix_cache.min_tokens"));
        assertTrue(problem("targets:\n  - {name: a, tokenizer: o200k_base, prefix_cache: {min_tokens: 8, ttl_seconds: 0}}\n")
                .contains("prefix_cache.ttl_seconds: must be above 0"));
    }

    @Test
    void brokenYamlIsOneLineNamingTheFile() throws IOException {
        String message = problem("templates:\n  include: [\"a\"\n");
        assertTrue(message.startsWith(dir.resolve("tare.yaml").toString() + ", line "), message);
        assertTrue(message.endsWith("line 3, column 1: a list in [ ] is not closed (opened on line 2), or an item in it"
                + " needs quotes; close it with ]"), message);
        assertTrue(problem("a: 1\na: 2\n").endsWith("line 2, column 2: the key 'a' appears twice in one mapping; keep one"),
                "duplicate keys refused");
    }

    @Test
    void unknownTargetsListTheConfiguredOnes() throws IOException {
        TareConfig config = load("targets:\n  - {name: a, tokenizer: o200k_base}\n  - {name: b, tokenizer: cl100k_base}\n");
        TareException e = assertThrows(TareException.class, () -> config.selectTargets(List.of("c")));
        assertEquals("unknown target 'c'; configured targets: a, b", e.getMessage());
    }

    @Test
    void aMissingFileSaysHowToMakeOne() {
        TareException e = assertThrows(TareException.class, () -> ConfigLoader.load(dir.resolve("nope.yaml")));
        assertTrue(e.getMessage().contains("tare init"), e.getMessage());
    }
}
