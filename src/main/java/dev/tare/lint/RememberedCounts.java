package dev.tare.lint;

import dev.tare.tokenize.Tokenizer;
import java.util.LinkedHashMap;
import java.util.Map;

/**
 * A tokenizer as rules get it: it remembers the counts of the last few long texts it counted, so
 * rules that count the same whole template (the budget estimate and its one section, the cache-order
 * total) pay for it once. Short texts are counted every time; remembering them would cost more
 * than counting them again.
 */
final class RememberedCounts implements Tokenizer {
    /** Texts shorter than this are not remembered. */
    static final int MIN_CHARS = 16_384;
    /** The rules of one template run one after another, so a few recent texts are enough. */
    private static final int REMEMBERED = 4;

    private final Tokenizer tokenizer;
    private final Map<String, Integer> counts = new LinkedHashMap<>(8, 0.75f, true) {
        @Override
        protected boolean removeEldestEntry(Map.Entry<String, Integer> eldest) {
            return size() > REMEMBERED;
        }
    };

    RememberedCounts(Tokenizer tokenizer) {
        this.tokenizer = tokenizer;
    }

    @Override
    public String name() {
        return tokenizer.name();
    }

    @Override
    public int count(String text) {
        if (text.length() < MIN_CHARS) {
            return tokenizer.count(text);
        }
        synchronized (counts) {
            Integer known = counts.get(text);
            if (known != null) {
                return known;
            }
        }
        int count = tokenizer.count(text);
        synchronized (counts) {
            counts.put(text, count);
        }
        return count;
    }

    @Override
    public int[] encode(String text) {
        return tokenizer.encode(text);
    }

    @Override
    public String toString() {
        return tokenizer.toString();
    }
}
