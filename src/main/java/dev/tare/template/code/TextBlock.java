package dev.tare.template.code;

/**
 * Removes the incidental white space of a Java text block as the Java Language Specification says
 * (JLS 17 §3.10.6, "as if by execution of String.stripIndent"), before escapes are interpreted: the
 * smallest indentation of the non-blank lines, and of the closing delimiter's line, comes off every
 * line, trailing white space goes, and blank lines become empty. When the content ends with a line
 * break (the closing delimiter starts its line) nothing is incidental. Where indentation was removed,
 * line breaks are not one to one: joining or splitting lines there would change how much is removed.
 */
final class TextBlock {
    private TextBlock() {
    }

    /** The content (line breaks already normalized to {@code \n}) with its incidental white space removed. */
    static DecodedText stripIndent(DecodedText content) {
        int n = content.length();
        DecodedText out = new DecodedText();
        if (n == 0) {
            return out;
        }
        boolean optOut = content.charAt(n - 1) == '\n';
        int outdent = optOut ? 0 : outdent(content);
        int start = 0;
        while (start < n) {
            int end = lineEnd(content, start);
            int first = indentEnd(content, start, end);
            int last = end;
            while (last > first && Character.isWhitespace(content.charAt(last - 1))) {
                last--;
            }
            if (first < last) {
                for (int k = start + Math.min(outdent, first - start); k < last; k++) {
                    out.copy(content, k);
                }
            }
            if (end < n) {
                if (outdent > 0) {
                    out.copyInexact(content, end);
                } else {
                    out.copy(content, end);
                }
            }
            start = end + 1;
        }
        return out;
    }

    /** Where the line that starts at {@code start} ends: at its line break, or at the end. */
    private static int lineEnd(DecodedText content, int start) {
        int end = start;
        while (end < content.length() && content.charAt(end) != '\n') {
            end++;
        }
        return end;
    }

    /** Where the white space that starts the line {@code [start, end)} ends. */
    private static int indentEnd(DecodedText content, int start, int end) {
        int first = start;
        while (first < end && Character.isWhitespace(content.charAt(first))) {
            first++;
        }
        return first;
    }

    /** The indentation that is incidental: the least of the non-blank lines and of a blank last line. */
    private static int outdent(DecodedText content) {
        int n = content.length();
        int outdent = Integer.MAX_VALUE;
        int start = 0;
        int lastLineStart = 0;
        while (start <= n) {
            int end = lineEnd(content, start);
            int first = indentEnd(content, start, end);
            if (first < end) {
                outdent = Math.min(outdent, first - start);
            }
            lastLineStart = start;
            if (end == n) {
                break;
            }
            start = end + 1;
        }
        int lastFirst = lastLineStart;
        while (lastFirst < n && Character.isWhitespace(content.charAt(lastFirst))) {
            lastFirst++;
        }
        if (lastFirst == n) {
            outdent = Math.min(outdent, n - lastLineStart);
        }
        return outdent;
    }
}
