package dev.tare.app;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.tare.TareException;
import dev.tare.config.ConfigLoader;
import dev.tare.config.TareConfig;
import dev.tare.lint.RuleCatalog;
import dev.tare.lint.Severity;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** The rules section of tare.yaml: disable, severity, packs. */
class RulePacksTest {
    @TempDir
    Path dir;

    private TareConfig config(String yaml) throws IOException {
        Files.writeString(dir.resolve("tare.yaml"), yaml);
        return ConfigLoader.load(dir.resolve("tare.yaml"));
    }

    @Test
    void disableAndSeverityApply() throws IOException {
        RuleCatalog catalog = RulePacks.catalog(config("rules:\n  disable: [space-run]\n  severity: {blank-lines: error}\n"));
        assertTrue(catalog.isDisabled("space-run"));
        assertFalse(catalog.enabled().stream().anyMatch(r -> r.descriptor().id().equals("space-run")));
        assertEquals(Severity.ERROR, catalog.severity(catalog.rule("blank-lines").descriptor()));
        assertEquals(Severity.WARNING, catalog.severity(catalog.rule("trailing-whitespace").descriptor()));
    }

    @Test
    void anUnknownRuleInDisableNamesTheFileLineAndKey() throws IOException {
        TareException e = assertThrows(TareException.class,
                () -> RulePacks.catalog(config("rules:\n  disable:\n    - space-runs\n")));
        assertTrue(e.getMessage().endsWith("tare.yaml, line 3: rules.disable[0]: unknown rule 'space-runs'; did you mean"
                + " 'space-run'?; 'tare rules' lists every rule"), e.getMessage());
    }

    @Test
    void anUnknownRuleOrSeverityInSeverityNamesTheKey() throws IOException {
        TareException rule = assertThrows(TareException.class,
                () -> RulePacks.catalog(config("rules:\n  severity: {no-such-rule: info}\n")));
        assertTrue(rule.getMessage().contains("rules.severity.no-such-rule: unknown rule 'no-such-rule'"), rule.getMessage());
        TareException level = assertThrows(TareException.class,
                () -> RulePacks.catalog(config("rules:\n  severity: {blank-lines: loud}\n")));
        assertTrue(level.getMessage().contains("rules.severity.blank-lines: unknown severity 'loud'"), level.getMessage());
    }

    @Test
    void packFoldersLoadAndAMissingOneIsAnError() throws IOException {
        Files.createDirectories(dir.resolve("house"));
        Files.writeString(dir.resolve("house/a.yaml"), "rules:\n  - id: no-shouting\n    summary: s\n    why: w\n"
                + "    class: none\n    severity: info\n    scope: prose\n    find: '[A-Z]{6,}'\n"
                + "    examples: [{before: 'STOP NOW PLEASE', after: 'Stop now'}]\n");
        assertTrue(RulePacks.catalog(config("rules: {packs: [house]}\n")).ids().contains("no-shouting"));
        TareException e = assertThrows(TareException.class, () -> RulePacks.catalog(config("rules: {packs: [nowhere]}\n")));
        assertTrue(e.getMessage().contains("rules.packs[0]: nowhere: no such rule-pack folder"), e.getMessage());
    }

    @Test
    void aPackRuleMayNotReuseABuiltInId() throws IOException {
        Files.createDirectories(dir.resolve("house"));
        Files.writeString(dir.resolve("house/a.yaml"), "rules:\n  - id: space-run\n    summary: s\n    why: w\n"
                + "    class: none\n    severity: info\n    scope: prose\n    find: x\n    examples: [{before: x, after: y}]\n");
        TareException e = assertThrows(TareException.class, () -> RulePacks.catalog(config("rules: {packs: [house]}\n")));
        assertTrue(e.getMessage().contains("rule 'space-run' is already defined in built-in"), e.getMessage());
    }
}
