package dev.tare.overlap;

import java.text.Normalizer;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.function.Predicate;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * Names a new partial for a block of text: from the block's first Markdown heading, else from its
 * first words (up to the end of the first sentence, at most {@value #MAX_WORDS}), written as
 * lower-case ASCII words joined by hyphens, in the partials folder, with {@code .md}. A name already
 * taken gets {@code -2}, {@code -3} and so on; no existing file is ever named.
 */
public final class PartialNames {
    /** The most words a name is made of. */
    static final int MAX_WORDS = 5;
    /** The name when the block has no letters or digits to name it by. */
    static final String FALLBACK = "shared-block";

    private static final Pattern HEADING = Pattern.compile("(?m)^[ \\t]{0,3}#{1,6}[ \\t]+(.+?)[ \\t#]*$");
    private static final Pattern WORD = Pattern.compile("[\\p{L}\\p{N}]+(?:['’][\\p{L}]+)?");

    private PartialNames() {
    }

    /**
     * A path for a new partial holding {@code block}.
     *
     * @param folder the partials folder, relative to the root, with {@code /}
     * @param taken  whether a root-relative path is already a file (or about to be one)
     * @return {@code folder/name.md}, where neither that nor {@code folder/name} is taken (an include
     *         of {@code name} would find the bare name first)
     */
    public static String choose(String block, String folder, Predicate<String> taken) {
        String base = stem(block);
        String prefix = folder.isEmpty() ? "" : folder + "/";
        for (int k = 1; ; k++) {
            String name = k == 1 ? base : base + "-" + k;
            if (!taken.test(prefix + name) && !taken.test(prefix + name + ".md")) {
                return prefix + name + ".md";
            }
        }
    }

    /** The name before any number is added: from the first heading, else the first words. */
    static String stem(String block) {
        Matcher heading = HEADING.matcher(block);
        String source = heading.find() ? heading.group(1) : firstSentence(block);
        List<String> words = new ArrayList<>();
        Matcher word = WORD.matcher(ascii(source));
        while (word.find() && words.size() < MAX_WORDS) {
            words.add(word.group().replaceAll("['’]", "").toLowerCase(Locale.ROOT));
        }
        return words.isEmpty() ? FALLBACK : String.join("-", words);
    }

    /** The block up to the end of its first sentence (or its first line). */
    private static String firstSentence(String block) {
        String text = block.strip();
        int end = text.length();
        for (int i = 0; i < text.length(); i++) {
            char c = text.charAt(i);
            if (c == '\n' || (".!?:;".indexOf(c) >= 0 && (i + 1 == text.length() || Character.isWhitespace(text.charAt(i + 1))))) {
                end = i;
                break;
            }
        }
        return text.substring(0, end);
    }

    /** Letters without their accents, and anything not ASCII dropped, so that names work on every file system. */
    private static String ascii(String text) {
        String decomposed = Normalizer.normalize(text, Normalizer.Form.NFKD).replaceAll("\\p{M}+", "");
        return decomposed.replaceAll("[^\\x20-\\x7E’]", " ");
    }
}
