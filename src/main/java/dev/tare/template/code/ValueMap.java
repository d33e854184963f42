package dev.tare.template.code;

import dev.tare.template.CharacterMap;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

/**
 * Where each character of a prompt's value is written in the file. A character is one to one when the
 * file holds exactly that character at that offset, as plain text of the literal; a character that
 * came from an escape, a normalized line break, a variable, or a line break whose indentation a text
 * block or dedent removed is not, and maps to the start of what it came from. Edits may touch only
 * one-to-one runs, and a fix should decode the edited file again to check the value it meant.
 */
public final class ValueMap implements CharacterMap {
    /**
     * A run of one-to-one characters: value {@code [valueStart, valueEnd)} is written at file
     * {@code [sourceStart, sourceStart + length)}.
     */
    public record Run(int valueStart, int valueEnd, int sourceStart) {
        public int length() {
            return valueEnd - valueStart;
        }

        public int sourceEnd() {
            return sourceStart + length();
        }
    }

    private final int[] from;
    private final int[] to;
    private final boolean[] exact;
    private final List<Run> runs;

    ValueMap(DecodedText text) {
        int n = text.length();
        from = new int[n];
        to = new int[n];
        exact = new boolean[n];
        List<Run> found = new ArrayList<>();
        int runStart = -1;
        for (int i = 0; i < n; i++) {
            from[i] = text.from(i);
            to[i] = text.to(i);
            exact[i] = text.exact(i);
            boolean continues = runStart >= 0 && exact[i] && from[i] == from[i - 1] + 1;
            if (!continues && runStart >= 0) {
                found.add(new Run(runStart, i, from[runStart]));
                runStart = -1;
            }
            if (exact[i] && runStart < 0) {
                runStart = i;
            }
        }
        if (runStart >= 0) {
            found.add(new Run(runStart, n, from[runStart]));
        }
        runs = List.copyOf(found);
    }

    /** The length of the value. */
    @Override
    public int length() {
        return from.length;
    }

    /** The file offset where value character {@code i} is written, or where what it came from starts. */
    @Override
    public int sourceOffset(int i) {
        return from[i];
    }

    /** The file offset just past what value character {@code i} came from. */
    @Override
    public int sourceEnd(int i) {
        return to[i];
    }

    /** Whether value character {@code i} is written in the file as itself. */
    @Override
    public boolean isOneToOne(int i) {
        return exact[i];
    }

    /** The maximal one-to-one runs, in value order. */
    public List<Run> runs() {
        return runs;
    }

    @Override
    public boolean equals(Object other) {
        return other instanceof ValueMap map && Arrays.equals(from, map.from) && Arrays.equals(to, map.to)
                && Arrays.equals(exact, map.exact);
    }

    @Override
    public int hashCode() {
        return Arrays.hashCode(from) * 31 + Arrays.hashCode(exact);
    }

    @Override
    public String toString() {
        return "ValueMap" + runs;
    }
}
