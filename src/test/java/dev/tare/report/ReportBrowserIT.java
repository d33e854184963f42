package dev.tare.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import dev.tare.cli.Cli;
import java.io.File;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.logging.Level;
import java.util.stream.Stream;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.openqa.selenium.By;
import org.openqa.selenium.Dimension;
import org.openqa.selenium.JavascriptExecutor;
import org.openqa.selenium.WebElement;
import org.openqa.selenium.chrome.ChromeDriver;
import org.openqa.selenium.chrome.ChromeDriverService;
import org.openqa.selenium.chrome.ChromeOptions;
import org.openqa.selenium.logging.LogEntry;
import org.openqa.selenium.logging.LogType;
import org.openqa.selenium.logging.LoggingPreferences;

/**
 * Renders the HTML report of a copy of {@code corpora/demo} in headless Chromium (the system's
 * {@code /usr/bin/chromium} and {@code /usr/bin/chromedriver}; nothing is downloaded) and checks what
 * a reader sees against the JSON reports of the same copy: the numbers, the charts, the console, and
 * that a script planted in a template stays text. Skipped when Chromium is not installed.
 */
class ReportBrowserIT {
    private static final Path CHROMIUM = Path.of("/usr/bin/chromium");
    private static final Path CHROMEDRIVER = Path.of("/usr/bin/chromedriver");
    private static final String PLANTED_TITLE = "planted script ran";
    private static final String PLANTED = "A planted test: <script>document.title = '" + PLANTED_TITLE + "';"
            + " window.tarePlanted = 1;</script> and <img src=\"x\" onerror=\"window.tarePlanted = 2\"> end.\n";

    @TempDir
    static Path work;
    private static ChromeDriver driver;
    private static JsonNode scan;
    private static JsonNode check;
    private static JsonNode fix;
    private static List<LogEntry> console;

    @BeforeAll
    static void render() throws IOException {
        assumeTrue(Files.isExecutable(CHROMIUM), "skipped: " + CHROMIUM + " is not installed (apt-get install chromium"
                + " chromium-driver); the HTML report's browser test needs it");
        assumeTrue(Files.isExecutable(CHROMEDRIVER), "skipped: " + CHROMEDRIVER + " is not installed (apt-get install"
                + " chromium-driver); the HTML report's browser test needs it");
        Path demo = work.resolve("demo");
        copy(Cli.projectDir().resolve("corpora/demo"), demo);
        Files.writeString(demo.resolve("prompts/system/planted.md"), PLANTED, StandardCharsets.UTF_8);
        Path report = work.resolve("report.html");
        Files.writeString(report, run("scan", demo.toString(), "--format", "html"), StandardCharsets.UTF_8);
        scan = new ObjectMapper().readTree(run("scan", demo.toString(), "--format", "json"));
        check = new ObjectMapper().readTree(Cli.run("check", demo.toString(), "--format", "json").out());
        fix = new ObjectMapper().readTree(Cli.run("fix", demo.toString(), "--include-review", "--dry-run", "--format",
                "json").out());

        System.setProperty("webdriver.chrome.driver", CHROMEDRIVER.toString());
        ChromeOptions options = new ChromeOptions();
        options.setBinary(CHROMIUM.toString());
        options.addArguments("--headless", "--no-sandbox", "--disable-gpu", "--disable-quic", "--no-first-run",
                "--disable-background-networking", "--disable-component-update", "--disable-sync",
                "--user-data-dir=" + Files.createDirectories(work.resolve("profile")), "--window-size=1280,1000");
        LoggingPreferences logs = new LoggingPreferences();
        logs.enable(LogType.BROWSER, Level.ALL);
        options.setCapability("goog:loggingPrefs", logs);
        ChromeDriverService service = new ChromeDriverService.Builder()
                .usingDriverExecutable(new File(CHROMEDRIVER.toString())).usingAnyFreePort().build();
        driver = new ChromeDriver(service, options);
        driver.get(report.toUri().toString());
        console = driver.manage().logs().get(LogType.BROWSER).getAll();
    }

    @AfterAll
    static void quit() {
        if (driver != null) {
            driver.quit();
        }
    }

    @Test
    void aScriptPlantedInATemplateDoesNotRunAndShowsAsText() {
        assertNotEquals(PLANTED_TITLE, driver.getTitle());
        assertTrue(driver.getTitle().startsWith("Tare report: "), driver.getTitle());
        Object planted = ((JavascriptExecutor) driver).executeScript("return typeof window.tarePlanted;");
        assertEquals("undefined", planted, "neither the script nor the image handler ran");
        assertTrue(driver.findElements(By.tagName("script")).isEmpty(), "no script element in the page");
        assertTrue(driver.findElements(By.tagName("img")).isEmpty(), "no image element in the page");
        String source = String.valueOf(((JavascriptExecutor) driver).executeScript(
                "return document.querySelector('details[data-path=\"prompts/system/planted.md\"] td.code').textContent;"));
        assertEquals(PLANTED.strip(), source, "the template's text, markup and all, is shown as text");
    }

    @Test
    void theConsoleHasNoErrors() {
        List<String> errors = console.stream().filter(e -> e.getLevel().intValue() >= Level.WARNING.intValue())
                .map(LogEntry::toString).toList();
        assertTrue(errors.isEmpty(), "console: " + errors);
    }

    @Test
    void chartsAreDrawnWithSize() {
        List<WebElement> charts = driver.findElements(By.cssSelector("svg.chart"));
        // One token chart, one cost chart per priced target, one KV chart per device target, one savings chart.
        long priced = 0;
        long devices = 0;
        for (String target : names(scan.get("targets_selected"))) {
            priced += anyTemplateHas(target, "cost_per_month") ? 1 : 0;
            devices += anyTemplateHas(target, "kv_cache_bytes") ? 1 : 0;
        }
        assertEquals(1 + priced + devices + 1, charts.size());
        for (WebElement chart : charts) {
            Dimension size = chart.getSize();
            assertTrue(size.getWidth() > 0 && size.getHeight() > 0, chart.getAttribute("data-chart") + " " + size);
        }
        // Rendered widths as the layout computed them (fractions of a pixel count: a 3-token framing part is thin).
        @SuppressWarnings("unchecked")
        List<Object> widths = (List<Object>) ((JavascriptExecutor) driver).executeScript("return Array.from("
                + "document.querySelectorAll('svg.chart rect.part'), r => r.getBoundingClientRect().width);");
        assertTrue(widths.size() >= scan.get("templates").size(), "bars: " + widths.size());
        for (Object width : widths) {
            assertTrue(((Number) width).doubleValue() > 0, "bar width " + width);
        }
    }

    @Test
    void numbersShownEqualTheJsonReport() {
        Map<String, JsonNode> templates = new HashMap<>();
        scan.get("templates").forEach(t -> templates.put(t.get("path").asText(), t));
        List<WebElement> cells = driver.findElements(By.cssSelector("[data-template][data-field]"));
        assertTrue(cells.size() > templates.size() * 3, "static, estimated and per-target figures: " + cells.size());
        for (WebElement cell : cells) {
            JsonNode template = templates.get(cell.getAttribute("data-template"));
            String target = cell.getAttribute("data-target");
            JsonNode owner = target == null ? template : template.get("targets").get(target);
            JsonNode expected = owner.get(cell.getAttribute("data-field"));
            assertEquals(expected.asDouble(), Double.parseDouble(cell.getAttribute("data-value")), 0,
                    describe(cell));
            assertShown(cell, expected.asDouble());
        }
        for (WebElement row : driver.findElements(By.cssSelector("svg[data-chart=tokens] g.bar"))) {
            JsonNode template = templates.get(row.getAttribute("data-template"));
            int staticTokens = Integer.parseInt(row.getAttribute("data-static"));
            int variables = Integer.parseInt(row.getAttribute("data-variables"));
            int framing = Integer.parseInt(row.getAttribute("data-framing"));
            // A bar is the first target's input tokens (the table's figure); its variables part is
            // what the samples and declared sizes add to the static text.
            assertEquals(template.get("estimated_tokens").asInt() - template.get("static_tokens").asInt(), variables);
            JsonNode first = template.get("targets").elements().hasNext() ? template.get("targets").elements().next() : null;
            assertEquals(first == null ? template.get("estimated_tokens").asInt() : first.get("input_tokens").asInt(),
                    staticTokens + variables + framing);
        }
    }

    @Test
    void totalsEqualTheJsonReport() {
        JsonNode totals = scan.get("totals");
        assertTotal("[data-total='totals.templates']", totals.get("templates").asDouble());
        assertTotal("[data-total='totals.static_tokens']", totals.get("static_tokens").asDouble());
        assertTotal("[data-total='totals.estimated_tokens']", totals.get("estimated_tokens").asDouble());
        assertTotal("[data-total='check.findings']", check.get("findings").size());
        assertTotal("[data-total='fix.saving_tokens']", fixSavings().values().stream().mapToDouble(d -> d).sum());
        for (String target : names(scan.get("targets_selected"))) {
            String at = "[data-target='" + target + "']";
            assertTotal(at + "[data-total='input_tokens']", totals.get("targets").get(target).get("input_tokens").asDouble());
            double cost = 0;
            long maxKv = -1;
            for (JsonNode template : scan.get("templates")) {
                JsonNode f = template.get("targets").get(target);
                if (f != null && template.get("kind").asText().matches("text|chat")) {
                    cost += f.path("cost_per_month").asDouble(0);
                    maxKv = Math.max(maxKv, f.path("kv_cache_bytes").asLong(-1));
                }
            }
            if (anyTemplateHas(target, "cost_per_month")) {
                assertTotal(at + "[data-total='cost_per_month']", cost);
            }
            if (maxKv >= 0) {
                assertTotal(at + "[data-total='max_kv_cache_bytes']", maxKv);
            }
        }
    }

    /**
     * What fix saves per rule applying every rewrite (the report's savings, issue #24): each file on its
     * own first tokenizer, summed.
     */
    private static Map<String, Double> fixSavings() {
        Map<String, Double> saving = new HashMap<>();
        for (JsonNode file : fix.get("files")) {
            String tokenizer = file.get("tokens").fieldNames().next();
            for (JsonNode rule : file.get("rules")) {
                saving.merge(rule.get("rule").asText(), rule.get("saved_tokens").path(tokenizer).asDouble(0), Double::sum);
            }
        }
        return saving;
    }

    @Test
    void savingsEqualFixsAndFindingsEqualTheCheckReport() {
        Map<String, Double> saving = fixSavings();
        Map<String, Integer> findings = new HashMap<>();
        for (JsonNode finding : check.get("findings")) {
            findings.merge(finding.get("rule").asText(), 1, Integer::sum);
        }
        List<WebElement> savingBars = driver.findElements(By.cssSelector("[data-rule][data-field='saving_tokens']"));
        assertFalse(savingBars.isEmpty());
        for (WebElement bar : savingBars) {
            assertEquals(saving.getOrDefault(bar.getAttribute("data-rule"), 0.0), Double.parseDouble(bar.getAttribute("data-value")), 0,
                    describe(bar));
        }
        for (WebElement cell : driver.findElements(By.cssSelector("td[data-rule][data-field='findings']"))) {
            assertEquals(findings.get(cell.getAttribute("data-rule")), Integer.parseInt(cell.getAttribute("data-value")));
            assertShown(cell, findings.get(cell.getAttribute("data-rule")));
        }
        assertEquals(check.get("findings").size(), driver.findElements(By.cssSelector("div.finding")).size(),
                "every finding is shown once, on its line");
    }

    private static void assertTotal(String selector, double expected) {
        List<WebElement> found = driver.findElements(By.cssSelector(selector));
        assertEquals(1, found.size(), selector);
        assertEquals(expected, Double.parseDouble(found.get(0).getAttribute("data-value")), Math.abs(expected) * 1e-12,
                selector);
        assertShown(found.get(0), expected);
    }

    /** The figure a reader sees equals {@code expected} to the precision it is written with. */
    private static void assertShown(WebElement element, double expected) {
        String unit = element.getAttribute("data-unit");
        String text = element.getTagName().equals("g")
                ? element.findElement(By.cssSelector("text.value")).getAttribute("textContent")
                : element.getAttribute("textContent");
        switch (unit == null ? "count" : unit) {
            case "money" -> assertEquals(expected, Double.parseDouble(text.replaceAll("[^0-9.]", "")), 0.005, text);
            case "bytes" -> assertEquals(expected, bytes(text), Math.max(0.5, expected * 0.005), text);
            default -> assertEquals((long) expected, Long.parseLong(text.replace(",", "").strip()), text);
        }
    }

    /** Bytes from a figure in binary units as the report writes them ({@code 225 MiB}, {@code 1,024 B}). */
    private static double bytes(String text) {
        String[] parts = text.strip().split(" ");
        List<String> units = List.of("B", "KiB", "MiB", "GiB", "TiB", "PiB");
        return Double.parseDouble(parts[0].replace(",", "")) * Math.pow(1024, units.indexOf(parts[1]));
    }

    private static boolean anyTemplateHas(String target, String field) {
        for (JsonNode template : scan.get("templates")) {
            if (template.get("targets").path(target).has(field)) {
                return true;
            }
        }
        return false;
    }

    private static List<String> names(JsonNode array) {
        List<String> names = new ArrayList<>();
        array.forEach(n -> names.add(n.asText()));
        return names;
    }

    private static String describe(WebElement element) {
        return element.getAttribute("outerHTML");
    }

    private static String run(String... args) {
        Cli.Run run = Cli.run(args);
        assertEquals(0, run.exitCode(), run.err());
        return run.out();
    }

    private static void copy(Path from, Path to) throws IOException {
        try (Stream<Path> files = Files.walk(from)) {
            for (Path file : (Iterable<Path>) files::iterator) {
                Path target = to.resolve(from.relativize(file).toString());
                if (Files.isDirectory(file)) {
                    Files.createDirectories(target);
                } else {
                    Files.copy(file, target);
                }
            }
        }
    }
}
