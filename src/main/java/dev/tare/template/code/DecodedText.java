package dev.tare.template.code;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

/**
 * Text decoded from string literals, built one character at a time, with each character's place in
 * the file: the file offsets it came from, whether the file holds exactly that character there (one to
 * one), which variable it belongs to, and which literal it came from. Escapes, normalized line breaks
 * and variables are not one to one, so that a later edit touches only text the file writes as itself.
 */
final class DecodedText {
    /** A per-call part of the text: its name and the file span of what it was written as. */
    record Variable(String name, int from, int to) {
    }

    private final StringBuilder text = new StringBuilder();
    private int[] from = new int[16];
    private int[] to = new int[16];
    private boolean[] exact = new boolean[16];
    private int[] variable = new int[16];
    private int[] piece = new int[16];
    private final List<Variable> variables = new ArrayList<>();
    private int currentPiece;

    int length() {
        return text.length();
    }

    char charAt(int i) {
        return text.charAt(i);
    }

    String text() {
        return text.toString();
    }

    String text(int start, int end) {
        return text.substring(start, end);
    }

    int from(int i) {
        return from[i];
    }

    int to(int i) {
        return to[i];
    }

    boolean exact(int i) {
        return exact[i];
    }

    /** The index of the variable character {@code i} belongs to, or -1 for text. */
    int variableAt(int i) {
        return variable[i];
    }

    /** The literal (or operand) of a joined value that character {@code i} came from. */
    int pieceAt(int i) {
        return piece[i];
    }

    Variable variable(int index) {
        return variables.get(index);
    }

    List<Variable> variables() {
        return variables;
    }

    /** Marks the characters appended from now on as coming from another literal or operand. */
    void nextPiece() {
        currentPiece++;
    }

    /** A character the file holds as itself at {@code at} (in the view's terms when it is not direct). */
    void copied(SourceView view, int i) {
        if (view.direct(i)) {
            add(view.charAt(i), view.from(i), view.to(i), true, -1);
        } else {
            add(view.charAt(i), view.from(i), view.to(i), false, -1);
        }
    }

    /** Characters that stand for the file's {@code [from, to)} without being written there as such. */
    void decoded(CharSequence chars, int fromOffset, int toOffset) {
        for (int k = 0; k < chars.length(); k++) {
            add(chars.charAt(k), fromOffset, toOffset, false, -1);
        }
    }

    void decoded(char c, int fromOffset, int toOffset) {
        add(c, fromOffset, toOffset, false, -1);
    }

    /** A variable named {@code name}, shown in the text as {@code shown}, written at the file's {@code [from, to)}. */
    void variable(String shown, String name, int fromOffset, int toOffset) {
        int index = variables.size();
        variables.add(new Variable(name, fromOffset, toOffset));
        for (int k = 0; k < shown.length(); k++) {
            add(shown.charAt(k), fromOffset, toOffset, false, index);
        }
    }

    /** Character {@code i} of {@code other}, as it is (its variable carried over), in the current piece. */
    void copy(DecodedText other, int i) {
        int index = other.variable[i];
        if (index >= 0) {
            Variable carried = other.variables.get(index);
            if (variables.isEmpty() || variables.get(variables.size() - 1) != carried) {
                variables.add(carried);
            }
            index = variables.size() - 1;
        }
        add(other.text.charAt(i), other.from[i], other.to[i], other.exact[i], index);
    }

    /** Character {@code i} of {@code other} as it is, but no longer one to one. */
    void copyInexact(DecodedText other, int i) {
        int before = length();
        copy(other, i);
        exact[before] = false;
    }

    /** All of {@code other}, starting a new piece. */
    void append(DecodedText other) {
        nextPiece();
        int lastPiece = -1;
        for (int i = 0; i < other.length(); i++) {
            if (other.piece[i] != lastPiece && i > 0) {
                nextPiece();
            }
            lastPiece = other.piece[i];
            copy(other, i);
        }
    }

    private void add(char c, int fromOffset, int toOffset, boolean isExact, int variableIndex) {
        int n = text.length();
        if (n == from.length) {
            int size = n * 2;
            from = Arrays.copyOf(from, size);
            to = Arrays.copyOf(to, size);
            exact = Arrays.copyOf(exact, size);
            variable = Arrays.copyOf(variable, size);
            piece = Arrays.copyOf(piece, size);
        }
        text.append(c);
        from[n] = fromOffset;
        to[n] = toOffset;
        exact[n] = isExact;
        variable[n] = variableIndex;
        piece[n] = currentPiece;
    }
}
