package dev.tare.lint.rules;

import static dev.tare.lint.RuleHarness.findings;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.tare.lint.Finding;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.SplittableRandom;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;

/**
 * The candidate index of near-duplicate-instruction finds exactly what comparing every pair of
 * sentences finds: the exhaustive comparison the rule used before the index is kept here as the
 * oracle, and the two are held to each other on the demo, the public prompts and random sentences.
 */
class NearDuplicateIndexTest {
    private final NearDuplicateInstruction indexed = new NearDuplicateInstruction();
    private final NearDuplicateInstruction exhaustive = new NearDuplicateInstruction(NearDuplicateIndexTest::everyPair);

    /** The rule's comparison before the index: every earlier sentence of the group, in order. */
    static List<NearDuplicateInstruction.Pair> everyPair(List<NearDuplicateInstruction.Compared> all) {
        List<NearDuplicateInstruction.Pair> pairs = new ArrayList<>();
        for (int j = 1; j < all.size(); j++) {
            NearDuplicateInstruction.Compared later = all.get(j);
            for (int i = 0; i < j; i++) {
                NearDuplicateInstruction.Compared earlier = all.get(i);
                if (earlier.group() != later.group()) {
                    continue;
                }
                if (earlier.text().equals(later.text())) {
                    break;
                }
                double similarity = earlier.words().cosine(later.words());
                if (similarity < NearDuplicateInstruction.MIN_COSINE) {
                    continue;
                }
                String a = earlier.lowerCase();
                String b = later.lowerCase();
                double edit = 1.0 - (double) fullEditDistance(a, b) / Math.max(a.length(), b.length());
                if (edit < NearDuplicateInstruction.MIN_LEVENSHTEIN) {
                    continue;
                }
                pairs.add(new NearDuplicateInstruction.Pair(i, j, similarity));
                break;
            }
        }
        return pairs;
    }

    /** The whole Levenshtein table, with no band. */
    private static int fullEditDistance(String a, String b) {
        int[][] d = new int[a.length() + 1][b.length() + 1];
        for (int i = 0; i <= a.length(); i++) {
            for (int j = 0; j <= b.length(); j++) {
                d[i][j] = i == 0 ? j : j == 0 ? i : Math.min(d[i - 1][j - 1] + (a.charAt(i - 1) == b.charAt(j - 1) ? 0 : 1),
                        Math.min(d[i - 1][j], d[i][j - 1]) + 1);
            }
        }
        return d[a.length()][b.length()];
    }

    @Test
    void theDemoGivesTheSameFindingsAsEveryPair() {
        int found = sameFindings(Path.of("corpora/demo"));
        assertTrue(found > 0, "the demo plants near-duplicate instructions");
    }

    @Test
    void thePublicPromptsGiveTheSameFindingsAsEveryPair() {
        sameFindings(Path.of("src/test/resources/public-prompts"));
    }

    /** Checks every text file under {@code root} with both comparisons; gives how many findings there were. */
    private int sameFindings(Path root) {
        int total = 0;
        try (Stream<Path> files = Files.walk(root)) {
            for (Path file : files.filter(Files::isRegularFile).filter(f -> f.toString().endsWith(".md")
                    || f.toString().endsWith(".txt") || f.toString().endsWith(".yaml")).sorted().toList()) {
                String text = Files.readString(file, StandardCharsets.UTF_8);
                String path = root.relativize(file).toString().replace('\\', '/');
                List<Finding> expected;
                try {
                    expected = findings(exhaustive, path, text, Map.of());
                } catch (RuntimeException e) {
                    continue; // a file this harness cannot parse is not a comparison
                }
                assertEquals(expected, findings(indexed, path, text, Map.of()), path);
                total += expected.size();
            }
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        return total;
    }

    @Test
    void tenThousandRandomCasesPairAsEveryPair() {
        String[] vocabulary = {"never", "always", "refund", "caller", "account", "supply", "meter", "reading", "bill",
                "twelve", "12", "months", "the", "a", "to", "do", "not", "agree", "plan", "supervisor", "approves",
                "Leak", "leak", "water", "pressure", "one", "1", "ask", "confirm", "address"};
        SplittableRandom random = new SplittableRandom(26);
        int paired = 0;
        for (int c = 0; c < 10_000; c++) {
            List<NearDuplicateInstruction.Compared> sentences = new ArrayList<>();
            Map<String, Integer> ids = new HashMap<>();
            int count = 2 + random.nextInt(30);
            int groups = 1 + random.nextInt(3);
            for (int s = 0; s < count; s++) {
                String text;
                if (s > 0 && random.nextInt(3) == 0) {
                    text = mutate(sentences.get(random.nextInt(s)).text(), vocabulary, random);
                } else {
                    StringBuilder words = new StringBuilder();
                    int length = 1 + random.nextInt(12);
                    for (int w = 0; w < length; w++) {
                        words.append(w == 0 ? "" : " ").append(vocabulary[random.nextInt(vocabulary.length)]);
                    }
                    text = words.toString();
                }
                sentences.add(new NearDuplicateInstruction.Compared(random.nextInt(groups), text,
                        text.toLowerCase(Locale.ROOT), NearDuplicateInstruction.WordVector.of(
                                NearDuplicateInstruction.words(text), ids)));
            }
            List<NearDuplicateInstruction.Pair> expected = everyPair(sentences);
            assertEquals(expected, NearDuplicateInstruction.pairs(sentences), "case " + c + ": " + sentences);
            paired += expected.size();
        }
        assertTrue(paired > 1000, "the random cases hold near duplicates: " + paired);
    }

    /** {@code text} with a word or two changed, dropped, added or repeated, or left as it is. */
    private static String mutate(String text, String[] vocabulary, SplittableRandom random) {
        List<String> words = new ArrayList<>(List.of(text.split(" ")));
        int changes = random.nextInt(3);
        for (int k = 0; k < changes; k++) {
            int at = random.nextInt(words.size());
            switch (random.nextInt(4)) {
                case 0 -> words.set(at, vocabulary[random.nextInt(vocabulary.length)]);
                case 1 -> {
                    if (words.size() > 1) {
                        words.remove(at);
                    }
                }
                case 2 -> words.add(at, vocabulary[random.nextInt(vocabulary.length)]);
                default -> words.add(at, words.get(at));
            }
        }
        return String.join(" ", words);
    }

    @Test
    void theBandedEditDistanceIsExactWithinItsLimitAndAboveItBeyond() {
        SplittableRandom random = new SplittableRandom(9);
        for (int c = 0; c < 20_000; c++) {
            String a = randomText(random);
            String b = random.nextBoolean() ? randomText(random) : a.substring(random.nextInt(a.length() + 1));
            int exact = fullEditDistance(a, b);
            int limit = random.nextInt(Math.max(a.length(), b.length()) + 2);
            int banded = NearDuplicateInstruction.editDistance(a, b, limit);
            if (exact <= limit) {
                assertEquals(exact, banded, a + " / " + b + " within " + limit);
            } else {
                assertTrue(banded > limit, a + " / " + b + " within " + limit + " gave " + banded);
            }
        }
    }

    private static String randomText(SplittableRandom random) {
        StringBuilder text = new StringBuilder();
        int length = random.nextInt(25);
        for (int i = 0; i < length; i++) {
            text.append("abcé ".charAt(random.nextInt(5)));
        }
        return text.toString();
    }
}
