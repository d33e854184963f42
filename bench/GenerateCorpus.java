import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.SplittableRandom;
import java.util.stream.Stream;

/**
 * Writes a synthetic template repository for Tare's scan benchmark: a {@code tare.yaml}, a few
 * dozen partials and COUNT template files in all (text with front matter, chat YAML, chat JSON)
 * under nested {@code prompts/<area>/<sub>/} folders, in the invented scenario of the booking
 * assistant of a regional ferry operator. The same COUNT and SEED always give byte-identical files.
 *
 * <p>Run with {@code java bench/GenerateCorpus.java OUT_DIR [COUNT] [SEED]}; no build is needed.
 */
public final class GenerateCorpus {
    static final int DEFAULT_COUNT = 20_000;
    static final long DEFAULT_SEED = 7_2024L;
    static final int MAX_PARTIALS = 40;
    /** Median and spread of the target file size: with the clamp below, about 5 KB on average. */
    static final double MEDIAN_BYTES = 2_930;
    static final double SIZE_SIGMA = 0.95;
    static final int MIN_BYTES = 300;
    static final int MAX_BYTES = 60_000;

    public static void main(String[] args) throws IOException {
        if (args.length < 1 || args.length > 3 || args[0].startsWith("-")) {
            System.err.println("usage: java bench/GenerateCorpus.java OUT_DIR [COUNT] [SEED]"
                    + " (default COUNT " + DEFAULT_COUNT + ", SEED " + DEFAULT_SEED + ")");
            System.exit(2);
        }
        Path out = Path.of(args[0]);
        int count = args.length > 1 ? parseInt(args[1], "COUNT") : DEFAULT_COUNT;
        long seed = args.length > 2 ? parseLong(args[2], "SEED") : DEFAULT_SEED;
        if (count < 1) {
            fail("COUNT must be 1 or more (got " + count + ")");
        }
        if (Files.exists(out) && (!Files.isDirectory(out) || !isEmpty(out))) {
            fail(out + " already exists and is not an empty folder; remove it or choose another OUT_DIR");
        }
        Corpus corpus = new Corpus(out, count, seed);
        corpus.write();
        System.out.println("wrote " + corpus.files + " files (" + count + " templates, " + corpus.partialCount
                + " of them partials, and tare.yaml), " + corpus.bytes + " bytes ("
                + String.format(Locale.ROOT, "%.1f", corpus.bytes / 1e6) + " MB) to " + out);
    }

    private static boolean isEmpty(Path dir) throws IOException {
        try (Stream<Path> entries = Files.list(dir)) {
            return entries.findAny().isEmpty();
        }
    }

    private static int parseInt(String text, String what) {
        try {
            return Integer.parseInt(text);
        } catch (NumberFormatException e) {
            fail(what + " must be a whole number (got '" + text + "')");
            return 0;
        }
    }

    private static long parseLong(String text, String what) {
        try {
            return Long.parseLong(text);
        } catch (NumberFormatException e) {
            fail(what + " must be a whole number (got '" + text + "')");
            return 0;
        }
    }

    private static void fail(String message) {
        System.err.println("GenerateCorpus: " + message);
        System.exit(2);
    }

    /**
     * Random choices drawn only from {@link SplittableRandom#nextLong()} and {@code split()}, whose
     * algorithms are fixed, so that output does not change between JDK releases.
     */
    static final class Dice {
        private final SplittableRandom random;

        Dice(SplittableRandom random) {
            this.random = random;
        }

        Dice split() {
            return new Dice(random.split());
        }

        /** A whole number in [0, bound). */
        int below(int bound) {
            return (int) (((random.nextLong() >>> 33) * bound) >>> 31);
        }

        /** A whole number in [low, high]. */
        int between(int low, int high) {
            return low + below(high - low + 1);
        }

        double unit() {
            return (random.nextLong() >>> 11) * 0x1.0p-53;
        }

        boolean chance(double p) {
            return unit() < p;
        }

        <T> T pick(List<T> items) {
            return items.get(below(items.size()));
        }

        String pick(String... items) {
            return items[below(items.length)];
        }

        /** A standard normal value (Box-Muller), for the log-normal spread of file sizes. */
        double gaussian() {
            double u = 1.0 - unit();
            double v = unit();
            return Math.sqrt(-2.0 * Math.log(u)) * Math.cos(2.0 * Math.PI * v);
        }
    }

    /** The whole repository: configuration, partials, templates, with running totals. */
    static final class Corpus {
        private final Path out;
        private final int count;
        private final Dice dice;
        private final int partialCount;
        private final List<String> partialNames = new ArrayList<>();
        private long files;
        private long bytes;

        Corpus(Path out, int count, long seed) {
            this.out = out;
            this.count = count;
            this.dice = new Dice(new SplittableRandom(seed));
            this.partialCount = Math.min(MAX_PARTIALS, Math.max(1, count / 20));
        }

        void write() {
            save("tare.yaml", config(), false);
            for (int i = 0; i < partialCount; i++) {
                partialNames.add(Words.partialName(i));
            }
            for (int i = 0; i < partialCount; i++) {
                Dice d = dice.split();
                save("prompts/partials/" + partialNames.get(i) + ".md", new Partials(d, partialNames, i).text(),
                        d.chance(0.05));
            }
            for (int i = 0; i < count - partialCount; i++) {
                Dice d = dice.split();
                Templates.Generated generated = new Templates(d, partialNames).template(i, targetSize(d));
                save(generated.path(), generated.text(), d.chance(0.05));
            }
        }

        private static int targetSize(Dice d) {
            double size = MEDIAN_BYTES * Math.exp(SIZE_SIGMA * d.gaussian());
            return (int) Math.max(MIN_BYTES, Math.min(MAX_BYTES, size));
        }

        private static String config() {
            return """
                    # Benchmark corpus written by bench/GenerateCorpus.java. Invented scenario, no prices.
                    templates:
                      include: ["prompts/**/*.md", "prompts/**/*.txt", "prompts/**/*.chat.yaml", "prompts/**/*.chat.json"]
                      placeholder: double-brace
                      partials: prompts/partials
                    targets:
                      - name: hosted-main
                        tokenizer: o200k_base
                        message_overhead_tokens: 3
                        reply_overhead_tokens: 3
                      - name: hosted-lite
                        tokenizer: cl100k_base
                        message_overhead_tokens: 4
                        reply_overhead_tokens: 3
                    budgets: {default: 4000, "prompts/planning/**": 12000}
                    """;
        }

        private void save(String relative, String text, boolean crlf) {
            String content = crlf ? text.replace("\n", "\r\n") : text;
            byte[] data = content.getBytes(StandardCharsets.UTF_8);
            Path file = out.resolve(relative);
            try {
                Files.createDirectories(file.getParent());
                Files.write(file, data);
            } catch (IOException e) {
                throw new UncheckedIOException(file + ": cannot be written", e);
            }
            files++;
            bytes += data.length;
        }
    }

    /**
     * Text written line by line, with now and then trailing blanks on a non-empty line (never on an
     * empty one, which YAML block scalars would read as indentation).
     */
    static final class Lines {
        private final StringBuilder text = new StringBuilder();
        private final Dice dice;
        private final double trailingChance;
        private final boolean tabs;

        Lines(Dice dice, double trailingChance, boolean tabs) {
            this.dice = dice;
            this.trailingChance = trailingChance;
            this.tabs = tabs;
        }

        Lines line(String line) {
            text.append(line);
            if (!line.isEmpty() && trailingChance > 0 && dice.chance(trailingChance)) {
                text.append(tabs && dice.chance(0.2) ? "\t" : dice.pick(" ", "  ", "   "));
            }
            text.append('\n');
            return this;
        }

        /** Adds text as it is, with no trailing blanks (YAML keys, where a stray tab would be an error). */
        Lines raw(String text) {
            this.text.append(text);
            return this;
        }

        Lines blank() {
            text.append('\n');
            return this;
        }

        /** Adds each line of a block; a final newline ends the last line rather than adding an empty one. */
        Lines block(String block) {
            for (String line : lines(block)) {
                line(line);
            }
            return this;
        }

        static String[] lines(String block) {
            String body = block.endsWith("\n") ? block.substring(0, block.length() - 1) : block;
            return body.split("\n", -1);
        }

        int length() {
            return text.length();
        }

        @Override
        public String toString() {
            return text.toString();
        }
    }

    /** Prose, lists, tables, code and placeholders about the ferry operator, drawn from word lists. */
    static final class Prose {
        private final Dice d;
        private final List<String> variables;

        /** @param variables the variable names this template may mention */
        Prose(Dice d, List<String> variables) {
            this.d = d;
            this.variables = variables;
        }

        String placeholder() {
            String name = d.pick(variables);
            return switch (d.below(12)) {
                case 0 -> "{{" + name + "}}";
                case 1 -> "{{ " + name + " | default(\"" + d.pick("", "unknown", "not given", "-") + "\") }}";
                case 2 -> "{{ " + name + " | upper }}";
                case 3 -> "{{- " + name + " -}}";
                default -> "{{ " + name + " }}";
            };
        }

        String sentence() {
            String s = switch (d.below(10)) {
                case 0, 1, 2 -> cap(d.pick(Words.SUBJECTS)) + " " + d.pick(Words.VERBS) + " " + d.pick(Words.NOUNS)
                        + " " + d.pick(Words.TAILS);
                case 3 -> d.pick("Never ", "Always ", "Do not forget to ", "Remember to ", "Try to ")
                        + d.pick(Words.IMPERATIVES) + " " + d.pick(Words.NOUNS) + " " + d.pick(Words.TAILS);
                case 4 -> "If " + d.pick(Words.CONDITIONS) + ", " + d.pick(Words.IMPERATIVES) + " "
                        + d.pick(Words.NOUNS) + " " + d.pick(Words.TAILS);
                case 5 -> cap(d.pick(Words.NOUNS)) + " " + d.pick("on the ", "aboard the ", "for the ") + vessel()
                        + " " + d.pick(Words.STATES);
                case 6 -> "Sailings from " + port() + " to " + port() + " take about " + d.between(25, 190)
                        + " minutes, and " + d.pick(Words.NOUNS) + " " + d.pick(Words.STATES);
                case 7 -> "Tell the passenger that " + d.pick(Words.NOUNS) + " " + d.pick(Words.STATES) + ", and "
                        + d.pick(Words.IMPERATIVES) + " " + d.pick(Words.NOUNS);
                case 8 -> "A " + d.pick("foot passenger", "driver", "cyclist", "family of four", "coach party",
                        "freight customer", "season-ticket holder") + " travelling on " + time() + " pays "
                        + price() + " " + d.pick(Words.TAILS);
                default -> cap(d.pick(Words.SUBJECTS)) + " " + d.pick(Words.VERBS) + " " + d.pick(Words.NOUNS)
                        + " (" + d.pick(Words.ASIDES) + ")";
            };
            if (!variables.isEmpty() && d.chance(0.22)) {
                s += d.pick(", for ", ", as shown in ", ", using ", " — see ", ", per ") + placeholder();
            }
            return s + d.pick(".", ".", ".", ".", ".", "!", "…", ". 🙂", ". ⛴️");
        }

        String paragraph(int minSentences, int maxSentences) {
            StringBuilder p = new StringBuilder();
            int n = d.between(minSentences, maxSentences);
            int width = 0;
            for (int i = 0; i < n; i++) {
                String s = sentence();
                // Wrapped like hand-written Markdown about half the time, one long line otherwise.
                if (width > 0 && d.chance(0.5) && width + s.length() > 90) {
                    p.append('\n');
                    width = 0;
                } else if (width > 0) {
                    p.append(' ');
                    width++;
                }
                p.append(s);
                width += s.length();
            }
            return p.toString();
        }

        String heading() {
            return cap(d.pick(Words.HEADINGS)) + d.pick("", "", "", " " + d.pick(Words.QUALIFIERS));
        }

        String bulletList() {
            StringBuilder out = new StringBuilder();
            String bullet = d.pick("- ", "* ", "- ");
            int n = d.between(3, 8);
            for (int i = 0; i < n; i++) {
                out.append(bullet).append(bulletText()).append('\n');
                if (d.chance(0.15)) {
                    out.append("  ").append(bullet).append(bulletText()).append('\n');
                }
            }
            return out.toString();
        }

        private String bulletText() {
            return switch (d.below(4)) {
                case 0 -> "**" + cap(d.pick(Words.NOUNS)) + ".** " + sentence();
                case 1 -> cap(d.pick(Words.IMPERATIVES)) + " " + d.pick(Words.NOUNS) + " " + d.pick(Words.TAILS) + ".";
                default -> sentence();
            };
        }

        String steps() {
            StringBuilder out = new StringBuilder();
            int n = d.between(3, 7);
            for (int i = 1; i <= n; i++) {
                out.append(i).append(". ").append(cap(d.pick(Words.IMPERATIVES))).append(' ')
                        .append(d.pick(Words.NOUNS)).append(' ').append(d.pick(Words.TAILS)).append('.');
                if (d.chance(0.4)) {
                    out.append(' ').append(sentence());
                }
                out.append('\n');
            }
            return out.toString();
        }

        String table() {
            StringBuilder out = new StringBuilder("| route | vessel | crossing | adult | car |\n|---|---|---|---:|---:|\n");
            int n = d.between(3, 9);
            for (int i = 0; i < n; i++) {
                out.append("| ").append(port()).append(" – ").append(port()).append(" | ").append(vessel())
                        .append(" | ").append(d.between(25, 190)).append(" min | ").append(price()).append(" | ")
                        .append(price()).append(" |\n");
            }
            return out.toString();
        }

        String jsonExample() {
            String ref = bookingRef();
            StringBuilder json = new StringBuilder("```json\n{\n");
            json.append("  \"booking_ref\": \"").append(ref).append("\",\n");
            json.append("  \"route\": {\"from\": \"").append(port()).append("\", \"to\": \"").append(port())
                    .append("\"},\n");
            json.append("  \"sailing\": \"").append(date()).append("T").append(time()).append("\",\n");
            json.append("  \"passengers\": [");
            int n = d.between(1, 4);
            for (int i = 0; i < n; i++) {
                json.append(i == 0 ? "" : ", ").append("{\"type\": \"")
                        .append(d.pick("adult", "child", "senior", "infant")).append("\", \"name\": \"")
                        .append(d.pick(Words.GIVEN)).append(' ').append(d.pick(Words.FAMILY)).append("\"}");
            }
            json.append("],\n");
            json.append("  \"vehicle\": ").append(d.chance(0.5) ? "null" : "{\"kind\": \"" + d.pick("car", "van",
                    "camper", "motorcycle", "bicycle") + "\", \"length_m\": " + d.between(2, 9) + "." + d.below(10) + "}")
                    .append(",\n");
            json.append("  \"status\": \"").append(d.pick("confirmed", "waitlisted", "changed", "cancelled"))
                    .append("\",\n");
            json.append("  \"total\": ").append(d.between(9, 420)).append('.').append(d.between(10, 99)).append('\n');
            json.append("}\n```\n");
            return json.toString();
        }

        String codeExample() {
            return switch (d.below(3)) {
                case 0 -> "```text\nBOOKING " + bookingRef() + "  " + date() + " " + time() + "  " + port() + " -> "
                        + port() + "\n  " + d.between(1, 6) + " PAX  " + d.pick("NO VEH", "CAR 4.6M", "VAN 5.8M")
                        + "  DECK " + d.pick("A", "B", "C") + "\n```\n";
                case 1 -> "```python\ndef fare(adults, children, vehicle_m=0.0):\n    base = " + d.between(12, 40)
                        + ".0 * adults + " + d.between(5, 20) + ".0 * children\n    return base + (" + d.between(3, 9)
                        + ".5 * vehicle_m if vehicle_m else 0.0)\n```\n";
                default -> "```\nREF      " + bookingRef() + "\nVESSEL   " + vessel() + "\nDEPARTS  " + time()
                        + "\nGATE     " + d.between(1, 6) + "\n```\n";
            };
        }

        String foreignLine() {
            return d.pick(Words.FOREIGN);
        }

        String fewShot() {
            StringBuilder out = new StringBuilder();
            int n = d.between(1, 3);
            for (int i = 0; i < n; i++) {
                out.append("User: ").append(d.pick(Words.QUESTIONS)).append('\n');
                out.append("Assistant: ").append(sentence()).append(' ').append(sentence()).append("\n\n");
            }
            return out.toString();
        }

        String port() {
            return d.pick(Words.PORTS);
        }

        String vessel() {
            return d.pick(Words.VESSELS);
        }

        String time() {
            return String.format(Locale.ROOT, "%02d:%02d", d.between(5, 22), d.below(12) * 5);
        }

        String date() {
            return String.format(Locale.ROOT, "2025-%02d-%02d", d.between(1, 12), d.between(1, 28));
        }

        String price() {
            return d.pick("€", "£", "") + d.between(4, 260) + "." + d.pick("00", "50", "25", "75", "95");
        }

        String bookingRef() {
            StringBuilder ref = new StringBuilder("VF");
            for (int i = 0; i < 6; i++) {
                ref.append("ABCDEFGHJKLMNPQRSTUVWXYZ23456789".charAt(d.below(32)));
            }
            return ref.toString();
        }

        static String cap(String s) {
            return s.isEmpty() ? s : Character.toUpperCase(s.charAt(0)) + s.substring(1);
        }
    }

    /** Template files: text with front matter, chat YAML, chat JSON. */
    static final class Templates {
        record Generated(String path, String text) {
        }

        private final Dice d;
        private final List<String> partials;

        Templates(Dice d, List<String> partials) {
            this.d = d;
            this.partials = partials;
        }

        Generated template(int index, int size) {
            String area = d.pick(Words.AREAS);
            StringBuilder folder = new StringBuilder("prompts/").append(area).append('/').append(d.pick(Words.SUBS));
            if (d.chance(0.3)) {
                folder.append('/').append(d.pick(Words.VARIANTS));
            }
            String stem = d.pick(Words.STEMS) + "-" + String.format(Locale.ROOT, "%05d", index);
            List<String> variables = chooseVariables();
            int kind = d.below(100);
            if (kind < 60) {
                return new Generated(folder + "/" + stem + ".md", text(area, variables, size, true));
            }
            if (kind < 75) {
                return new Generated(folder + "/" + stem + ".txt", text(area, variables, size, d.chance(0.5)));
            }
            if (kind < 90) {
                return new Generated(folder + "/" + stem + ".chat.yaml", chatYaml(area, variables, size));
            }
            return new Generated(folder + "/" + stem + ".chat.json", chatJson(area, variables, size));
        }

        private List<String> chooseVariables() {
            List<String> chosen = new ArrayList<>();
            int n = d.between(1, 8);
            for (int i = 0; i < n; i++) {
                String name = d.pick(Words.VARIABLES);
                if (!chosen.contains(name)) {
                    chosen.add(name);
                }
            }
            return chosen;
        }

        private String text(String area, List<String> variables, int size, boolean frontMatter) {
            Lines out = new Lines(d, d.chance(0.3) ? 0.03 : 0.0, true);
            if (frontMatter) {
                Lines header = new Lines(d, 0.0, false);
                meta(header, variables);
                out.raw("---\n").raw(header.toString()).raw("---\n");
            }
            Prose prose = new Prose(d, variables);
            if (d.chance(0.3)) {
                out.line("{# " + Prose.cap(area) + " prompt. Owner: " + d.pick(Words.TEAMS) + ". #}").blank();
            }
            out.line("# " + Prose.cap(Words.COMPANY) + " " + d.pick("booking assistant", "ferry desk",
                    "travel helper", "crossing planner") + ": " + area.replace('-', ' ')).blank();
            out.block(Words.INTRO.replace("$1", prose.placeholder()).replace("$2", prose.port())).blank();
            body(out, prose, size);
            return out.toString();
        }

        private void body(Lines out, Prose prose, int size) {
            while (out.length() < size) {
                switch (d.below(20)) {
                    case 0, 1, 2, 3, 4 -> out.line("## " + prose.heading()).blank().block(prose.paragraph(2, 7)).blank();
                    case 5, 6 -> out.block(prose.paragraph(1, 5)).blank();
                    case 7, 8 -> out.block(prose.bulletList()).blank();
                    case 9 -> out.block(prose.steps()).blank();
                    case 10 -> out.block(prose.table()).blank();
                    case 11 -> out.line(prose.paragraph(1, 1)).blank().block(prose.jsonExample()).blank();
                    case 12 -> out.block(prose.codeExample()).blank();
                    case 13 -> out.line(include()).blank();
                    case 14 -> out.line("{% if " + d.pick(Words.FLAGS) + " %}").block(prose.paragraph(1, 3))
                            .line(d.chance(0.4) ? "{% else %}" : "").block(prose.paragraph(1, 2)).line("{% endif %}")
                            .blank();
                    case 15 -> out.line("{% for leg in itinerary %}")
                            .line("- {{ leg.departs }} from {{ leg.port }} on the {{ leg.vessel }}")
                            .line("{% endfor %}").blank();
                    case 16 -> out.line(prose.foreignLine()).blank();
                    case 17 -> out.line("### " + d.pick("Examples", "Worked examples", "Sample turns")).blank()
                            .block(prose.fewShot());
                    case 18 -> {
                        String flag = d.pick(Words.FLAGS);
                        out.line("{{# " + flag + " }}").block(prose.paragraph(1, 2)).line("{{/ " + flag + " }}").blank();
                    }
                    default -> {
                        if (d.chance(0.3)) {
                            out.line("{% raw %}Write booking codes as {{ REF }} in the confirmation, literally.{% endraw %}")
                                    .blank();
                        } else {
                            out.line("{{! " + d.pick("reviewed", "keep short", "checked with the harbour office",
                                    "legal wording, do not edit") + " }}").block(prose.paragraph(1, 3)).blank();
                        }
                    }
                }
            }
        }

        private String include() {
            String name = d.pick(partials);
            return switch (d.below(4)) {
                case 0 -> "{% include \"" + name + ".md\" %}";
                case 1 -> "{{> \"" + name + "\" }}";
                default -> "{{> " + name + " }}";
            };
        }

        /** Front matter keys, or those beside a chat file's messages. */
        private void meta(Lines out, List<String> variables) {
            if (d.chance(0.1)) {
                out.line("target: hosted-lite");
            }
            if (d.chance(0.6)) {
                out.line("budget: " + d.between(8, 120) * 50);
            }
            if (d.chance(0.4)) {
                out.line("output_tokens: " + d.between(2, 40) * 25);
            }
            List<String> declared = new ArrayList<>();
            for (String name : variables) {
                if (d.chance(0.8)) {
                    declared.add(name);
                }
            }
            if (declared.isEmpty()) {
                return;
            }
            out.line("variables:");
            for (String name : declared) {
                out.line("  " + name + ":" + variableSpec(name));
            }
        }

        private String variableSpec(String name) {
            return switch (d.below(10)) {
                case 0 -> "";
                case 1 -> " " + d.between(1, 400);
                case 2 -> " \"" + yamlEscape(Words.sample(name, d)) + "\"";
                case 3, 4, 5 -> " {tokens: " + d.between(1, 600) + "}";
                default -> " {sample: \"" + yamlEscape(Words.sample(name, d)) + "\"}";
            };
        }

        private String messageContent(Prose prose, int size) {
            Lines content = new Lines(d, d.chance(0.3) ? 0.03 : 0.0, false);
            content.block(prose.paragraph(1, 3));
            if (d.chance(0.5)) {
                content.blank().line(include());
            }
            body(content, prose, size);
            return content.toString().stripTrailing();
        }

        private String chatYaml(String area, List<String> variables, int size) {
            Lines out = new Lines(d, d.chance(0.3) ? 0.03 : 0.0, false);
            out.line("# " + Prose.cap(area.replace('-', ' ')) + " chat for the " + Words.COMPANY + " booking assistant.");
            meta(out, variables);
            out.line("messages:");
            Prose prose = new Prose(d, variables);
            int systemSize = Math.max(200, size * 2 / 3);
            out.line("  - role: system").line("    content: |");
            indent(out, messageContent(prose, systemSize), "      ");
            while (out.length() < size) {
                out.line("  - role: user").line("    content: " + yamlQuoted(d.pick(Words.QUESTIONS)));
                out.line("  - role: assistant").line("    content: |");
                indent(out, prose.paragraph(1, 4), "      ");
            }
            out.line("  - role: user").line("    content: \"{{ passenger_message }}\"");
            return out.toString();
        }

        private static void indent(Lines out, String block, String prefix) {
            for (String line : Lines.lines(block)) {
                if (line.isEmpty()) {
                    out.blank();
                } else {
                    out.line(prefix + line);
                }
            }
        }

        private String chatJson(String area, List<String> variables, int size) {
            boolean asciiOnly = d.chance(0.15);
            Prose prose = new Prose(d, variables);
            Lines header = new Lines(d, 0.0, false);
            meta(header, variables);
            StringBuilder out = new StringBuilder("{\n");
            jsonMeta(out, header.toString(), asciiOnly);
            out.append("  \"messages\": [\n");
            int systemSize = Math.max(200, size * 2 / 3);
            List<String[]> messages = new ArrayList<>();
            messages.add(new String[] {"system", messageContent(prose, systemSize)});
            int approx = systemSize;
            while (approx < size) {
                String question = d.pick(Words.QUESTIONS);
                String answer = prose.paragraph(1, 4);
                messages.add(new String[] {"user", question});
                messages.add(new String[] {"assistant", answer});
                approx += question.length() + answer.length() + 80;
            }
            messages.add(new String[] {"user", "{{ passenger_message }}"});
            boolean parts = d.chance(0.2);
            for (int i = 0; i < messages.size(); i++) {
                String role = messages.get(i)[0];
                String content = jsonString(messages.get(i)[1], asciiOnly);
                out.append("    {\n      \"role\": \"").append(role).append("\",\n");
                if (parts && role.equals("system")) {
                    out.append("      \"content\": [{\"type\": \"text\", \"text\": ").append(content).append("}]\n");
                } else {
                    out.append("      \"content\": ").append(content).append('\n');
                }
                out.append(i + 1 < messages.size() ? "    },\n" : "    }\n");
            }
            out.append("  ],\n  \"description\": ").append(jsonString(Prose.cap(area.replace('-', ' '))
                    + " chat for the " + Words.COMPANY + " booking assistant", asciiOnly)).append("\n}\n");
            return out.toString();
        }

        /** Turns the simple YAML that {@link #meta} writes into JSON members. */
        private static void jsonMeta(StringBuilder out, String yaml, boolean asciiOnly) {
            boolean inVariables = false;
            List<String> members = new ArrayList<>();
            List<String> variableMembers = new ArrayList<>();
            for (String line : yaml.split("\n")) {
                if (line.isBlank()) {
                    continue;
                }
                if (line.equals("variables:")) {
                    inVariables = true;
                    continue;
                }
                int colon = line.indexOf(':');
                String key = line.substring(0, colon).strip();
                String value = line.substring(colon + 1).strip();
                String json = yamlValueToJson(value, asciiOnly);
                if (inVariables) {
                    variableMembers.add("\"" + key + "\": " + json);
                } else {
                    members.add("  \"" + key + "\": " + json);
                }
            }
            if (!variableMembers.isEmpty()) {
                members.add("  \"variables\": {\n    " + String.join(",\n    ", variableMembers) + "\n  }");
            }
            for (String member : members) {
                out.append(member).append(",\n");
            }
        }

        private static String yamlValueToJson(String value, boolean asciiOnly) {
            if (value.isEmpty()) {
                return "null";
            }
            if (value.startsWith("\"")) {
                return jsonString(yamlUnescape(value.substring(1, value.length() - 1)), asciiOnly);
            }
            if (value.startsWith("{tokens: ")) {
                return "{\"tokens\": " + value.substring(9, value.length() - 1) + "}";
            }
            if (value.startsWith("{sample: \"")) {
                return "{\"sample\": " + jsonString(yamlUnescape(value.substring(10, value.length() - 2)), asciiOnly) + "}";
            }
            if (Character.isDigit(value.charAt(0))) {
                return value;
            }
            return jsonString(value, asciiOnly);
        }

        private static String yamlEscape(String s) {
            return s.replace("\\", "\\\\").replace("\"", "\\\"");
        }

        private static String yamlUnescape(String s) {
            return s.replace("\\\"", "\"").replace("\\\\", "\\");
        }

        private static String yamlQuoted(String s) {
            return "\"" + yamlEscape(s) + "\"";
        }

        static String jsonString(String s, boolean asciiOnly) {
            StringBuilder out = new StringBuilder(s.length() + 16).append('"');
            for (int i = 0; i < s.length(); i++) {
                char c = s.charAt(i);
                switch (c) {
                    case '"' -> out.append("\\\"");
                    case '\\' -> out.append("\\\\");
                    case '\n' -> out.append("\\n");
                    case '\t' -> out.append("\\t");
                    case '\r' -> out.append("\\r");
                    default -> {
                        if (c < 0x20 || (asciiOnly && c > 0x7E)) {
                            out.append(String.format(Locale.ROOT, "\\u%04x", (int) c));
                        } else {
                            out.append(c);
                        }
                    }
                }
            }
            return out.append('"').toString();
        }
    }

    /** Shared snippets (policies, tone, safety) in {@code prompts/partials}, some including later ones. */
    static final class Partials {
        private final Dice d;
        private final List<String> names;
        private final int index;

        Partials(Dice d, List<String> names, int index) {
            this.d = d;
            this.names = names;
            this.index = index;
        }

        String text() {
            List<String> variables = new ArrayList<>();
            if (d.chance(0.4)) {
                variables.add(d.pick(Words.VARIABLES));
            }
            Prose prose = new Prose(d, variables.isEmpty() ? List.of("passenger_name") : variables);
            Lines out = new Lines(d, 0.02, true);
            if (!variables.isEmpty() && d.chance(0.5)) {
                out.line("---").line("variables:").line("  " + variables.get(0) + ": {tokens: " + d.between(2, 40) + "}")
                        .line("---");
            }
            out.line("### " + Prose.cap(names.get(index).replace('/', ' ').replace('-', ' '))).blank();
            int size = d.between(200, 3_000);
            while (out.length() < size) {
                switch (d.below(4)) {
                    case 0 -> out.block(prose.bulletList());
                    case 1 -> out.block(prose.steps());
                    default -> out.block(prose.paragraph(2, 5)).blank();
                }
            }
            // Only later partials, so that includes between partials never form a cycle.
            if (index + 1 < names.size() && d.chance(0.3)) {
                out.blank().line("{{> " + names.get(d.between(index + 1, names.size() - 1)) + " }}");
            }
            return out.toString();
        }
    }

    /** The word lists of the invented scenario. Every name here is made up. */
    static final class Words {
        static final String COMPANY = "Vellamore Ferries";

        static final List<String> AREAS = List.of("bookings", "rebooking", "refunds", "fares", "timetable",
                "disruption", "vehicles", "freight", "accessibility", "pets", "cabins", "loyalty", "groups",
                "onboard", "ports", "lost-property", "complaints", "crew-briefings", "safety", "planning");
        static final List<String> SUBS = List.of("web-chat", "phone", "kiosk", "email", "agents", "few-shot",
                "system", "tools", "summaries", "classifiers", "handoff", "extraction");
        static final List<String> VARIANTS = List.of("summer", "winter", "v2", "island-routes", "mainland",
                "night-sailings", "experimental");
        static final List<String> STEMS = List.of("greeting", "triage", "explain-fare", "confirm-change",
                "summarise-call", "classify-intent", "extract-booking", "draft-reply", "policy-check",
                "handover-note", "apology", "waitlist-offer", "seat-map", "deck-plan", "tide-notice",
                "weather-hold", "manifest-check", "receipt", "faq", "escalation");
        static final List<String> TEAMS = List.of("digital desk", "harbour operations", "customer care",
                "fleet planning", "revenue team", "island liaison");
        static final List<String> PARTIAL_BASES = List.of("safety-briefing", "tone-of-voice", "refund-rules",
                "pet-policy", "vehicle-limits", "accessibility-help", "identity-check", "privacy-notice",
                "weather-policy", "cabin-rules", "loyalty-terms", "group-travel", "freight-rules",
                "closing-remarks", "handover-format", "tool-usage", "language-support", "timetable-notes",
                "port-directions", "lost-property-steps");
        static final List<String> PARTIAL_FOLDERS = List.of("", "", "", "policies/", "style/");

        static final List<String> SUBJECTS = List.of("the booking assistant", "a passenger", "the duty officer",
                "each sailing", "the harbour office", "the ticket desk", "foot passengers", "drivers with a vehicle",
                "a season-ticket holder", "the crew", "the timetable", "the fare engine", "the purser",
                "the island liaison", "every confirmation email", "the check-in lane", "the waitlist",
                "the car deck supervisor", "a coach operator", "the night crossing");
        static final List<String> VERBS = List.of("must confirm", "should check", "may change", "will not refund",
                "can rebook", "needs to see", "records", "explains", "looks up", "compares", "offers", "holds",
                "releases", "prints", "updates", "never shares", "double-checks", "reads back", "waives",
                "recalculates");
        static final List<String> IMPERATIVES = List.of("confirm", "check", "explain", "look up", "compare",
                "offer", "hold", "release", "read back", "mention", "recalculate", "quote", "summarise",
                "ask about", "apologise for");
        static final List<String> NOUNS = List.of("the booking reference", "the vehicle length", "the cabin allocation",
                "the departure time", "the tide window", "the fare difference", "the deck space", "the pet policy",
                "the wheelchair space", "the boarding pass", "the standby list", "the weather warning",
                "the loyalty points", "the freight manifest", "the return leg", "the change fee",
                "the check-in cut-off", "the island resident discount", "the bicycle rack", "the lounge upgrade",
                "the refund to the original card", "the lift on deck 5", "the quiet cabin", "the group rate",
                "the concession fare", "the height limit for vans", "the trailer charge", "the meal voucher");
        static final List<String> TAILS = List.of("before the sailing closes", "at least forty minutes before departure",
                "when the forecast shows a gale", "for every leg of the journey", "on the day of travel",
                "if the harbour is closed", "without charging a fee", "unless the duty manager agrees",
                "during the summer timetable", "for sailings after 20:00", "in the passenger's own words",
                "before taking any payment", "when the vessel is full", "for island residents only",
                "as the terms and conditions say", "after a cancellation", "while the passenger waits",
                "on the next available crossing", "in the confirmation message", "when the tide is low");
        static final List<String> STATES = List.of("is subject to weather", "changes with the season",
                "stays the same on the return leg", "is shown on the boarding pass", "needs a manual check",
                "is free for children under five", "opens sixty minutes before departure",
                "closes when the ramp goes up", "is limited to four per sailing", "can be moved once for free");
        static final List<String> CONDITIONS = List.of("the sailing is cancelled", "the passenger is travelling with a dog",
                "the vehicle is over 6 metres", "the booking was made by an agent", "the crossing is overnight",
                "the passenger asks for a human", "the payment failed", "the name on the booking is wrong",
                "the forecast is amber", "the passenger needs step-free access");
        static final List<String> ASIDES = List.of("see the fares table", "this often confuses people",
                "the harbour office can confirm", "as of the winter timetable", "ask if unsure",
                "not for freight bookings", "island residents differ", "rare, but it happens");
        static final List<String> HEADINGS = List.of("how to answer", "what you can do", "changing a booking",
                "cancellations and refunds", "vehicles on board", "travelling with pets", "cabins and lounges",
                "when the weather turns", "accessibility", "freight and trailers", "group bookings",
                "the loyalty scheme", "check-in and boarding", "lost property", "complaints",
                "privacy and identity", "tone and wording", "tools you can call", "handing over to staff",
                "ending the conversation");
        static final List<String> QUALIFIERS = List.of("(summer)", "(winter)", "for island residents",
                "— read first", "in detail", "✅", "⚠️");
        static final List<String> FLAGS = List.of("has_vehicle", "is_resident", "weather_hold", "has_pets",
                "needs_assistance", "is_group", "overnight", "loyalty_member", "late_change");
        static final List<String> VARIABLES = List.of("passenger_name", "booking_ref", "departure_port",
                "arrival_port", "sailing_date", "sailing_time", "vessel_name", "vehicle_reg", "fare_class",
                "cabin_type", "weather_summary", "tide_window", "loyalty_tier", "balance_due", "refund_amount",
                "language", "channel", "today", "crossing_minutes", "pet_count", "booking.ref",
                "passenger.first_name", "sailing.departs_at", "itinerary", "agent_notes", "conversation_summary",
                "retrieved_policies", "tool_results");
        static final List<String> NAMES = List.of("Aoife Brannagh", "Zoë Ferrand-Llosa", "Linnéa Østergård", "李静",
                "田中 ゆき", "Ruairi MacArdle", "Noor Haddad", "José Álvarez");
        static final List<String> TEXT_SAMPLES = List.of("Wind south-west 5 to 7, moderate swell, rain later.",
                "The passenger asked twice about the return leg and is \"very worried\" about the weather.",
                "Booking VF7KQ2MX: 2 adults, 1 child, car 4.6 m, return 14 June. Paid by card.",
                "Refunds go to the original card within 5 to 7 working days; vouchers never expire.",
                "🐕 one small dog, travelling in the car; the passenger asked about the pet lounge.",
                "Customer called about a double charge; agent confirmed one payment was reversed.");
        static final List<String> PORTS = List.of("Port Avel", "Inchvarra Quay", "Tarn Keld", "Brisca Point",
                "Oldhaven", "Maelstrand", "Sennick Bay", "Corrowan", "Dunvarra Pier", "Éilis Harbour",
                "Port Sølvik", "Lanhydra", "Little Sulvaig", "Kilvrennan");
        static final List<String> VESSELS = List.of("MV Sennick Lass", "MV Tarn Keld", "MV Corrowan Spirit",
                "MV Brisca Star", "MV Maelstrand", "MV Isle of Lanhydra", "MV Gannet Rock", "MV Ørnøy");
        static final List<String> GIVEN = List.of("Aoife", "Ruairi", "Maëlle", "Tomasz", "Ines", "Kenji", "Wen",
                "Siobhán", "Pádraig", "Noor", "José", "Freya");
        static final List<String> FAMILY = List.of("Brannagh", "Corrie", "Ferrand", "Nowak", "Sato", "Li",
                "MacArdle", "Ó Dálaigh", "Haddad", "Álvarez", "Lindqvist");
        static final List<String> QUESTIONS = List.of("Can I move my crossing to tomorrow?",
                "Is the 7:15 from Port Avel running today?", "How much is it to bring a campervan?",
                "My dog is 30 kg, can she stay in the car?", "Do you have a cabin on the night sailing?",
                "I was charged twice for booking VF7KQ2MX.", "Where do I queue with a bicycle?",
                "Est-ce que le ferry de 14 h est annulé ?", "Can my mum get help boarding? She uses a wheelchair.",
                "What happens to my ticket if the sailing is cancelled for weather?",
                "明天去 Tarn Keld 的船还有位子吗？", "I left my jacket on the MV Brisca Star yesterday 😩",
                "Why did my fare go up when I changed the date?", "Can I add a trailer to my booking?");
        static final List<String> FOREIGN = List.of(
                "Bienvenue à bord — le départ est prévu à 14 h 05 ; merci de rester à l'écart de la rampe.",
                "Willkommen an Bord! Bitte bleiben Sie während der Überfahrt nicht auf dem Fahrzeugdeck.",
                "乗船券をご用意ください。出航の三十分前までに乗り場へお越しください。",
                "请在开船前三十分钟到达码头，并准备好您的预订编号。",
                "Bienvenido a bordo: la cafetería abre después de la salida. ☕",
                "Velkommen om bord på MV Ørnøy — kafeen åpner når vi har forlatt kaia.",
                "Fáilte ar bord! Tá an caifé ar deic 5. 🌊",
                "승선권을 준비해 주세요. 차량 갑판에는 머무를 수 없습니다.",
                "⚓ Tip: the quiet lounge on deck 6 is free for loyalty members ✨",
                "Note for agents — résumé, naïve, coöperate, façade: keep the accents as the passenger wrote them.");
        static final String INTRO = """
                You are the booking assistant for Vellamore Ferries, the regional ferry operator that links
                the mainland at $2 with the Vellamore islands. You are helping $1. Answer questions about
                sailings, fares, vehicles, cabins and changes to existing bookings, and call the tools you are
                given for every fact about a booking or a sailing.""";

        /** A sample value that fits the variable's name. */
        static String sample(String variable, Dice d) {
            return switch (variable) {
                case "passenger_name", "passenger.first_name" -> d.pick(NAMES);
                case "booking_ref", "booking.ref" -> d.pick("VF7KQ2MX", "VFJG22TE", "VF3NSFJU", "VFLBAUJ9");
                case "departure_port", "arrival_port" -> d.pick(PORTS);
                case "sailing_date", "today" -> d.pick("Friday 12 June", "2025-06-12", "Sunday 3 August", "12/06/2025");
                case "sailing_time", "sailing.departs_at" -> d.pick("14:35", "07:15", "21:50");
                case "vessel_name" -> d.pick(VESSELS);
                case "vehicle_reg" -> d.pick("VK21 ROX", "ZK-4471", "11-D-90432");
                case "fare_class" -> d.pick("standard", "saver", "island resident", "flexible");
                case "cabin_type" -> d.pick("two-berth inside cabin", "four-berth outside cabin", "pet-friendly cabin");
                case "loyalty_tier" -> d.pick("bronze", "silver", "gold tier ✨");
                case "balance_due", "refund_amount" -> d.pick("€48.50", "£112.00", "19.95");
                case "language" -> d.pick("English", "français", "Deutsch", "日本語", "中文");
                case "channel" -> d.pick("web chat", "phone", "kiosk at the terminal", "email");
                case "crossing_minutes", "pet_count" -> String.valueOf(d.between(0, 190));
                default -> d.pick(TEXT_SAMPLES);
            };
        }

        static String partialName(int i) {
            String base = PARTIAL_BASES.get(i % PARTIAL_BASES.size());
            String folder = PARTIAL_FOLDERS.get(i % PARTIAL_FOLDERS.size());
            return folder + base + (i < PARTIAL_BASES.size() ? "" : "-" + (i / PARTIAL_BASES.size() + 1));
        }
    }
}
