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

    /** Marks the characters added from now on as coming from piece {@code piece}, such as the piece of the text they replace. */
    void usePiece(int piece) {
        currentPiece = piece;
    }

    /** Character {@code i} of the view, one to one when the file holds it as itself there. */
    void copied(SourceView view, int i) {
        add(view.charAt(i), view.from(i), view.to(i), view.direct(i), -1, currentPiece);
    }

    /** Characters that stand for the file's {@code [from, to)} without being written there as such. */
    void decoded(CharSequence chars, int fromOffset, int toOffset) {
        for (int k = 0; k < chars.length(); k++) {
            add(chars.charAt(k), fromOffset, toOffset, false, -1, currentPiece);
        }
    }

    void decoded(char c, int fromOffset, int toOffset) {
        add(c, fromOffset, toOffset, false, -1, currentPiece);
    }

    /** A variable named {@code name}, shown in the text as {@code shown}, written at the file's {@code [from, to)}. */
    void variable(String shown, String name, int fromOffset, int toOffset) {
        int index = variables.size();
        variables.add(new Variable(name, fromOffset, toOffset));
        for (int k = 0; k < shown.length(); k++) {
            add(shown.charAt(k), fromOffset, toOffset, false, index, currentPiece);
        }
    }

    /** Character {@code i} of {@code other}, as it is: its variable and its piece carried over. */
    void copy(DecodedText other, int i) {
        copy(other, i, other.piece[i]);
    }

    private void copy(DecodedText other, int i, int pieceIndex) {
        int index = other.variable[i];
        if (index >= 0) {
            Variable carried = other.variables.get(index);
            if (variables.isEmpty() || variables.get(variables.size() - 1) != carried) {
                variables.add(carried);
            }
            index = variables.size() - 1;
        }
        add(other.text.charAt(i), other.from[i], other.to[i], other.exact[i], index, pieceIndex);
        currentPiece = pieceIndex;
    }

    /** Character {@code i} of {@code other} as it is, but no longer one to one. */
    void copyInexact(DecodedText other, int i) {
        int before = length();
        copy(other, i);
        exact[before] = false;
    }

    /** All of {@code other} after what is here, its pieces kept apart from these. */
    void append(DecodedText other) {
        int base = length() == 0 ? currentPiece : currentPiece + 1;
        int last = base;
        for (int i = 0; i < other.length(); i++) {
            last = Math.max(last, base + other.piece[i]);
            copy(other, i, base + other.piece[i]);
        }
        currentPiece = last;
    }

    private void add(char c, int fromOffset, int toOffset, boolean isExact, int variableIndex, int pieceIndex) {
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
        piece[n] = pieceIndex;
    }
}
