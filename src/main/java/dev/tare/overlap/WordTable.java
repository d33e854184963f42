package dev.tare.overlap;

import java.util.Arrays;

/**
 * Gives each distinct word a number from 1 up, reading words straight out of the text they stand in,
 * so that a word seen before costs no new string.
 */
final class WordTable {
    private String[] keys = new String[1 << 12];
    private int[] numbers = new int[1 << 12];
    private String[] words = new String[1 << 12];
    private int size;

    /** The number of {@code text[start, end)}, given it when new. */
    int intern(String text, int start, int end) {
        int hash = hash(text, start, end);
        int mask = keys.length - 1;
        for (int slot = hash & mask; ; slot = (slot + 1) & mask) {
            String key = keys[slot];
            if (key == null) {
                String word = text.substring(start, end);
                keys[slot] = word;
                numbers[slot] = ++size;
                if (size == words.length) {
                    words = Arrays.copyOf(words, words.length * 2);
                }
                words[size] = word;
                if (size * 2 > keys.length) {
                    grow();
                }
                return size;
            }
            if (key.length() == end - start && key.regionMatches(0, text, start, end - start)) {
                return numbers[slot];
            }
        }
    }

    /** How many distinct words there are: the largest number given. */
    int size() {
        return size;
    }

    /** The word with number {@code number}. */
    String word(int number) {
        return words[number];
    }

    private void grow() {
        String[] oldKeys = keys;
        int[] oldNumbers = numbers;
        keys = new String[oldKeys.length * 2];
        numbers = new int[oldKeys.length * 2];
        int mask = keys.length - 1;
        for (int i = 0; i < oldKeys.length; i++) {
            if (oldKeys[i] != null) {
                int slot = hash(oldKeys[i], 0, oldKeys[i].length()) & mask;
                while (keys[slot] != null) {
                    slot = (slot + 1) & mask;
                }
                keys[slot] = oldKeys[i];
                numbers[slot] = oldNumbers[i];
            }
        }
    }

    private static int hash(String text, int start, int end) {
        int h = 0;
        for (int i = start; i < end; i++) {
            h = 31 * h + text.charAt(i);
        }
        // Spread the high bits down, as the table keeps only the low ones.
        return h ^ (h >>> 16);
    }
}
