package dev.tare.bench;

import java.nio.charset.StandardCharsets;
import java.util.List;
import java.util.SplittableRandom;

/**
 * The texts the benchmarks feed Tare: ordinary prompt text (Markdown headings, paragraphs, lists,
 * placeholders and inline code about an invented ferry operator, drawn from fixed word lists with a
 * fixed seed, so every run reads the same bytes) and the pathological inputs the rule engine must
 * stay linear on. Sizes are UTF-8 bytes.
 */
final class BenchTexts {
    /** One line of the identical-lines input: an ordinary sentence of ordinary length. */
    static final String IDENTICAL_LINE =
            "Always read the booking reference back to the passenger before you change anything.\n";

    private static final List<String> SUBJECTS = List.of("the duty manager", "the booking desk", "the purser",
            "the harbour office", "the fare engine", "the check-in lane", "the deck crew", "every confirmation email",
            "the waitlist", "the island liaison");
    private static final List<String> VERBS = List.of("must confirm", "should check", "may change", "never shares",
            "reads back", "looks up", "compares", "holds", "releases", "recalculates", "explains", "records");
    private static final List<String> NOUNS = List.of("the booking reference", "the vehicle length",
            "the cabin allocation", "the departure time", "the tide window", "the fare difference", "the pet policy",
            "the boarding pass", "the standby list", "the change fee", "the return leg", "the refund to the card",
            "the trailer charge", "the quiet cabin", "the loyalty points");
    private static final List<String> TAILS = List.of("before the sailing closes", "on the day of travel",
            "when the forecast shows a gale", "for every leg of the journey", "without charging a fee",
            "unless the duty manager agrees", "in the passenger's own words", "before taking any payment",
            "after a cancellation", "while the passenger waits");
    private static final List<String> MANNERS = List.of("", "", "", "", "politely", "in one short sentence",
            "and says so", "each time", "by phone", "in writing", "for groups too", "on request", "without delay",
            "if asked twice", "at the desk", "in the app", "for island residents", "on the night crossing",
            "before boarding", "once the ramp is up", "for foot passengers", "for drivers", "with care",
            "as a rule", "in plain words");
    private static final List<String> HEADINGS = List.of("How to answer", "Changing a booking",
            "Cancellations and refunds", "Vehicles on board", "Travelling with pets", "When the weather turns",
            "Tools you can call", "Handing over to staff");
    private static final List<String> VARIABLES = List.of("passenger_name", "booking_ref", "sailing_date",
            "departure_port", "fare_class", "weather_summary");

    private BenchTexts() {
    }

    /** Ordinary prompt text of {@code bytes} UTF-8 bytes (give or take a few at the very end). */
    static String ordinary(int bytes, long seed) {
        SplittableRandom random = new SplittableRandom(seed);
        StringBuilder text = new StringBuilder(bytes + 256);
        int length = 0;
        while (length < bytes) {
            String block = block(random);
            text.append(block);
            length += utf8Length(block);
        }
        return cut(text.toString(), bytes);
    }

    /**
     * Ordinary sentences on one line of {@code bytes} UTF-8 bytes, the last of them a line break:
     * what a minified or machine-written template looks like.
     */
    static String singleLine(int bytes, long seed) {
        SplittableRandom random = new SplittableRandom(seed);
        StringBuilder text = new StringBuilder(bytes + 256);
        int length = 0;
        while (length < bytes) {
            String sentence = sentence(random) + " ";
            text.append(sentence);
            length += utf8Length(sentence);
        }
        String line = cut(text.toString(), bytes - 1);
        return line + "\n";
    }

    /** {@code lines} copies of {@link #IDENTICAL_LINE}, one paragraph with no blank line between them. */
    static String identicalLines(int lines) {
        return IDENTICAL_LINE.repeat(lines);
    }

    /**
     * A line of {@code bytes} UTF-8 bytes that is almost all spaces, with a word on each side, so the
     * spaces stand between words as a run to shrink.
     */
    static String spaces(int bytes) {
        String before = "Reply";
        String after = "briefly.\n";
        return before + " ".repeat(bytes - before.length() - after.length()) + after;
    }

    /** The UTF-8 length of {@code text}. */
    static int utf8Length(String text) {
        return text.getBytes(StandardCharsets.UTF_8).length;
    }

    private static String block(SplittableRandom random) {
        return switch (random.nextInt(10)) {
            case 0 -> "## " + pick(random, HEADINGS) + "\n\n";
            case 1, 2 -> list(random) + "\n";
            default -> paragraph(random) + "\n\n";
        };
    }

    private static String paragraph(SplittableRandom random) {
        StringBuilder paragraph = new StringBuilder();
        int sentences = 2 + random.nextInt(5);
        for (int i = 0; i < sentences; i++) {
            if (i > 0) {
                // Wrapped like hand-written Markdown half the time.
                paragraph.append(random.nextBoolean() ? "\n" : " ");
            }
            paragraph.append(sentence(random));
        }
        return paragraph.toString();
    }

    private static String list(SplittableRandom random) {
        StringBuilder list = new StringBuilder();
        int items = 2 + random.nextInt(4);
        for (int i = 0; i < items; i++) {
            list.append("- ").append(sentence(random)).append('\n');
        }
        return list.toString();
    }

    private static String sentence(SplittableRandom random) {
        String manner = pick(random, MANNERS);
        String sentence = cap(pick(random, SUBJECTS)) + " " + pick(random, VERBS) + " " + pick(random, NOUNS) + " "
                + pick(random, TAILS) + (manner.isEmpty() ? "" : " " + manner);
        sentence += switch (random.nextInt(8)) {
            case 0 -> " for {{ " + pick(random, VARIABLES) + " }}";
            case 1 -> ", using `lookup_" + pick(random, VARIABLES) + "`";
            case 2 -> " within " + (5 + random.nextInt(115)) + " minutes";
            case 3 -> " \u2014 see the fares table";
            default -> "";
        };
        return sentence + (random.nextInt(12) == 0 ? "!" : ".");
    }

    private static String pick(SplittableRandom random, List<String> words) {
        return words.get(random.nextInt(words.size()));
    }

    private static String cap(String text) {
        return Character.toUpperCase(text.charAt(0)) + text.substring(1);
    }

    /** {@code text} cut to at most {@code bytes} UTF-8 bytes, at a character boundary. */
    private static String cut(String text, int bytes) {
        int length = 0;
        for (int i = 0; i < text.length(); ) {
            int codePoint = text.codePointAt(i);
            int size = codePoint < 0x80 ? 1 : codePoint < 0x800 ? 2 : codePoint < 0x10000 ? 3 : 4;
            if (length + size > bytes) {
                return text.substring(0, i);
            }
            length += size;
            i += Character.charCount(codePoint);
        }
        return text;
    }
}
