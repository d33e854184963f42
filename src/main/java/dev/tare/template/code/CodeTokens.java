package dev.tare.template.code;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

/**
 * What a lexer made of a file: its tokens in parallel arrays (kind, start, end in the lexer's view),
 * the string literals they carry, its comments, and the reason it stopped early, if it did. Bracket
 * pairs are matched once, so that the finder jumps over a bracketed group in one step.
 */
final class CodeTokens {
    static final byte WORD = 0;
    static final byte STRING = 1;
    static final byte OP = 2;
    static final byte NEWLINE = 3;
    /** A literal that is never a prompt: a number, a character, a regular expression, a byte string. */
    static final byte VALUE = 4;

    /** A comment: its span in the view and its text without the comment markers. */
    record Comment(int start, int end, String text) {
    }

    /**
     * A string literal: its decoded text, whether its fields were read already (f-strings, template
     * literals), and the first token of the tag before a tagged template literal (-1 when untagged).
     */
    record StringLiteral(DecodedText text, boolean interpolated, int tagStart) {
        StringLiteral(DecodedText text, boolean interpolated) {
            this(text, interpolated, -1);
        }
    }

    final SourceView view;
    private byte[] kinds = new byte[64];
    private int[] starts = new int[64];
    private int[] ends = new int[64];
    private int size;
    private final List<StringLiteral> literals = new ArrayList<>();
    private int[] literalIndex = new int[64];
    final List<Comment> comments = new ArrayList<>();
    private String stop;
    private int[] match;
    private int[] opener;

    CodeTokens(SourceView view) {
        this.view = view;
    }

    void add(byte kind, int start, int end) {
        add(kind, start, end, null);
    }

    void add(byte kind, int start, int end, StringLiteral literal) {
        if (size == kinds.length) {
            int grown = size * 2;
            kinds = Arrays.copyOf(kinds, grown);
            starts = Arrays.copyOf(starts, grown);
            ends = Arrays.copyOf(ends, grown);
            literalIndex = Arrays.copyOf(literalIndex, grown);
        }
        kinds[size] = kind;
        starts[size] = start;
        ends[size] = end;
        if (literal != null) {
            literalIndex[size] = literals.size();
            literals.add(literal);
        } else {
            literalIndex[size] = -1;
        }
        size++;
    }

    void stop(String reason) {
        if (stop == null) {
            stop = reason;
        }
    }

    boolean stopped() {
        return stop != null;
    }

    String stopReason() {
        return stop;
    }

    int size() {
        return size;
    }

    byte kind(int i) {
        return kinds[i];
    }

    int start(int i) {
        return starts[i];
    }

    int end(int i) {
        return ends[i];
    }

    /** The token's text as the lexer read it. */
    String text(int i) {
        return view.text().substring(starts[i], ends[i]);
    }

    /** Whether token {@code i} is the operator or punctuation {@code op}. */
    boolean is(int i, String op) {
        return i >= 0 && i < size && kinds[i] == OP && ends[i] - starts[i] == op.length()
                && view.text().startsWith(op, starts[i]);
    }

    /** Whether token {@code i} is the word {@code word}. */
    boolean isWord(int i, String word) {
        return i >= 0 && i < size && kinds[i] == WORD && ends[i] - starts[i] == word.length()
                && view.text().startsWith(word, starts[i]);
    }

    StringLiteral literal(int i) {
        return literalIndex[i] < 0 ? null : literals.get(literalIndex[i]);
    }

    /** The token that closes the bracket opened at {@code i} (or opens the one closed there), or -1. */
    int match(int i) {
        return match()[i];
    }

    /** The innermost bracket open around token {@code i}, or -1 at the top level. */
    int opener(int i) {
        match();
        return opener[i];
    }

    private int[] match() {
        if (match == null) {
            match = new int[size];
            opener = new int[size];
            Arrays.fill(match, -1);
            int[] stack = new int[16];
            int depth = 0;
            for (int i = 0; i < size; i++) {
                opener[i] = depth == 0 ? -1 : stack[depth - 1];
                if (kinds[i] != OP || ends[i] - starts[i] != 1) {
                    continue;
                }
                char c = view.charAt(starts[i]);
                if (c == '(' || c == '[' || c == '{') {
                    if (depth == stack.length) {
                        stack = Arrays.copyOf(stack, depth * 2);
                    }
                    stack[depth++] = i;
                } else if (c == ')' || c == ']' || c == '}') {
                    // A closer that does not fit the innermost opener is left unmatched, and so is the opener.
                    if (depth > 0 && fits(view.charAt(starts[stack[depth - 1]]), c)) {
                        int open = stack[--depth];
                        match[open] = i;
                        match[i] = open;
                        opener[i] = depth == 0 ? -1 : stack[depth - 1];
                    }
                }
            }
        }
        return match;
    }

    private static boolean fits(char open, char close) {
        return open == '(' ? close == ')' : open == '[' ? close == ']' : close == '}';
    }
}
