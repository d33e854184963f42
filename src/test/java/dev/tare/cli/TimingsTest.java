package dev.tare.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.tare.testing.Git;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** {@code --timings} on the commands people time: one line on standard error whose parts add up to the total. */
class TimingsTest {
    static final Pattern LINE = Pattern.compile(
            "timings: start (\\d+) ms, tokenizer load (\\d+) ms, work (\\d+) ms, total (\\d+) ms; class-data archive: (.+)");

    @TempDir
    Path repo;

    @BeforeEach
    void repositoryWithAStagedTemplate() throws Exception {
        Git.run(repo, "init", "-q");
        Files.createDirectories(repo.resolve("prompts"));
        Files.writeString(repo.resolve("tare.yaml"), "templates: {include: [\"prompts/*.md\"]}\n"
                + "targets: [{name: a, tokenizer: o200k_base}, {name: b, tokenizer: cl100k_base}]\n");
        Files.writeString(repo.resolve("prompts/a.md"), "Answer billing questions briefly.\n");
        Git.run(repo, "add", ".");
    }

    /** Checks the one line and returns its archive status; the parts are rounded one by one, so they may miss the total by a rounding each. */
    static String checkedLine(String err) {
        String[] lines = err.strip().split("\n");
        Matcher m = LINE.matcher(lines[lines.length - 1]);
        assertTrue(m.matches(), err);
        long parts = Long.parseLong(m.group(1)) + Long.parseLong(m.group(2)) + Long.parseLong(m.group(3));
        assertTrue(Math.abs(parts - Long.parseLong(m.group(4))) <= 2, "start + load + work = total: " + err);
        return m.group(5);
    }

    @Test
    void countPrintsTheBreakdown() {
        Cli.Run run = Cli.run("count", "--timings", repo.resolve("prompts/a.md").toString());
        assertEquals(0, run.exitCode(), run.err());
        assertEquals("none", checkedLine(run.err()), "the tests run without an archive");
        assertEquals(1, run.err().lines().count(), run.err());
    }

    @Test
    void scanCheckAndTheHookPrintTheBreakdown() {
        String config = repo.resolve("tare.yaml").toString();
        for (String[] args : new String[][] {
                {"scan", "--timings", repo.toString()},
                {"check", "--staged", "--timings", repo.toString()},
                {"hook", "run", "--timings", "--config", config}}) {
            Cli.Run run = Cli.run(args);
            assertEquals(0, run.exitCode(), String.join(" ", args) + ": " + run.err());
            checkedLine(run.err());
            assertEquals(1, run.err().lines().count(), run.err());
        }
    }

    @Test
    void theLoadFigureIsThisCommandsOwnNotTheProcesss() {
        String file = repo.resolve("prompts/a.md").toString();
        for (String tokenizer : new String[] {"p50k_base", "r50k_base", "cl100k_base"}) {
            Cli.run("count", "--tokenizer", tokenizer, file);
        }
        // Earlier loads in this process would push the load figure past the command's own time.
        checkedLine(Cli.run("count", "--timings", "--tokenizer", "r50k_base", file).err());
    }
}
