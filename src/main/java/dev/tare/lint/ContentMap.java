package dev.tare.lint;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;

/**
 * Where each character of a message's content stands in the file. For a text template this is a
 * plain shift; for a chat file it follows the YAML or JSON string the content was read from, and a
 * character is <em>verbatim</em> when the file holds exactly that character there (not an escape, a
 * folded line break or indentation). Edits are moved onto the file only across verbatim text, and
 * only with replacements the string's quoting can hold as written.
 */
final class ContentMap {
    /** How the content is quoted in the file, which decides what a replacement may contain. */
    enum Style {
        /** Text template body: any replacement. */
        TEXT,
        /** A JSON or YAML double-quoted string: no quotes, backslashes or control characters. */
        DOUBLE_QUOTED,
        /** A YAML single-quoted string: no single quotes or line breaks. */
        SINGLE_QUOTED,
        /** A YAML literal block: line breaks only where line breaks are removed. */
        LITERAL_BLOCK,
        /**
         * A string literal of source code: nothing a language gives a meaning inside some literal
         * (quotes, backslashes, braces, {@code $}, {@code %}, line breaks, control characters), and
         * only over characters the file holds as themselves, never across an escape or a variable.
         */
        CODE,
        /** Positions are known or approximate, but no edit can be written back. */
        READ_ONLY
    }

    /** What some language's literal gives a meaning to: quotes, escapes, fields and format verbs. */
    private static final String CODE_SPECIAL = "'\"`\\{}$%";

    private final int[] offsets;
    private final boolean[] verbatim;
    private final Style style;

    ContentMap(int[] offsets, boolean[] verbatim, Style style) {
        this.offsets = offsets;
        this.verbatim = verbatim;
        this.style = style;
    }

    /** A content that starts at {@code base} in the file and is a verbatim copy of it. */
    static ContentMap shifted(int base, int length) {
        int[] offsets = new int[length + 1];
        boolean[] verbatim = new boolean[length];
        for (int i = 0; i <= length; i++) {
            offsets[i] = base + i;
        }
        java.util.Arrays.fill(verbatim, true);
        return new ContentMap(offsets, verbatim, Style.TEXT);
    }

    /** A prompt's value written as string literals, placed and edited through {@code map}. */
    static ContentMap ofLiteral(dev.tare.template.CharacterMap map) {
        int length = map.length();
        int[] offsets = new int[length + 1];
        boolean[] verbatim = new boolean[length];
        for (int i = 0; i < length; i++) {
            offsets[i] = map.sourceOffset(i);
            verbatim[i] = map.isOneToOne(i);
        }
        offsets[length] = length == 0 ? 0 : map.sourceEnd(length - 1);
        return new ContentMap(offsets, verbatim, Style.CODE);
    }

    /** A content whose characters can only be placed at {@code at}, with nothing writable. */
    static ContentMap approximate(int at, int length) {
        int[] offsets = new int[length + 1];
        java.util.Arrays.fill(offsets, at);
        return new ContentMap(offsets, new boolean[length], Style.READ_ONLY);
    }

    /** The file offset of content offset {@code i} (the end maps just past the last character). */
    int sourceOffset(int i) {
        return offsets[Math.max(0, Math.min(i, offsets.length - 1))];
    }

    /** The edits moved onto the file, or empty when any of them cannot be written back exactly. */
    Optional<List<Edit>> toSource(String content, List<Edit> edits) {
        if (style == Style.READ_ONLY) {
            return Optional.empty();
        }
        List<Edit> moved = new ArrayList<>();
        for (Edit edit : edits) {
            if (!contiguous(edit.start(), edit.end()) || !holds(content.substring(edit.start(), edit.end()), edit.replacement())) {
                return Optional.empty();
            }
            int start = anchor(edit.start());
            moved.add(new Edit(start, start + (edit.end() - edit.start()), edit.replacement()));
        }
        return Optional.of(moved);
    }

    /**
     * One edit replacing content {@code [start, end)} as a whole: from the file offset of its first
     * character to that of the character after it (or just past its last), whatever escapes, folded
     * breaks or indentation lie between. Empty when either end is not verbatim or the quoting cannot
     * hold {@code replacement} as written. The caller must check what the file then reads as, since
     * the text between the ends is not followed character by character.
     */
    Optional<Edit> span(int start, int end, String replacement) {
        return span(start, end).flatMap(place -> place.by(replacement));
    }

    /** Where a replacement of content {@code [start, end)} as a whole would stand (see {@link #span(int, int, String)}). */
    Optional<Replaceable> span(int start, int end) {
        if (style == Style.READ_ONLY || start >= end) {
            return Optional.empty();
        }
        if (style == Style.CODE && !contiguous(start, end)) {
            // An escape or a variable inside would be replaced as written, not as it reads.
            return Optional.empty();
        }
        int from = start < verbatim.length && verbatim[start] ? offsets[start] : -1;
        int to = end < verbatim.length && verbatim[end] ? offsets[end] : verbatim[end - 1] ? offsets[end - 1] + 1 : -1;
        if (from < 0 || to < from) {
            return Optional.empty();
        }
        return Optional.of(new Replaceable(from, to, style));
    }

    private int anchor(int i) {
        if (i < verbatim.length && verbatim[i]) {
            return offsets[i];
        }
        return i > 0 && verbatim[i - 1] ? offsets[i - 1] + 1 : -1;
    }

    private boolean contiguous(int start, int end) {
        if (anchor(start) < 0) {
            return false;
        }
        for (int i = start; i < end; i++) {
            if (!verbatim[i] || (i > start && offsets[i] != offsets[i - 1] + 1)) {
                return false;
            }
        }
        return true;
    }

    private boolean holds(String removed, String replacement) {
        return holds(style, removed, replacement);
    }

    static boolean holds(Style style, String removed, String replacement) {
        return switch (style) {
            case TEXT -> true;
            case DOUBLE_QUOTED -> replacement.chars().noneMatch(c -> c == '"' || c == '\\' || c < 0x20);
            case SINGLE_QUOTED -> replacement.chars().noneMatch(c -> c == '\'' || c == '\n' || c == '\r');
            case LITERAL_BLOCK -> replacement.indexOf('\n') < 0 && replacement.indexOf('\r') < 0
                    || onlyLineBreaks(removed) && onlyLineBreaks(replacement);
            // A line break the file holds as itself stands in a literal that holds line breaks.
            case CODE -> replacement.chars().noneMatch(c -> CODE_SPECIAL.indexOf(c) >= 0 || c < 0x20)
                    && removed.chars().noneMatch(c -> CODE_SPECIAL.indexOf(c) >= 0)
                    || onlyLineBreaks(removed) && onlyLineBreaks(replacement);
            case READ_ONLY -> false;
        };
    }

    private static boolean onlyLineBreaks(String text) {
        return text.chars().allMatch(c -> c == '\n');
    }
}
