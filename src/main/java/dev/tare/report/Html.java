package dev.tare.report;

/**
 * The HTML report's escaping and small building blocks. Every piece of text from a template, a path,
 * a configuration or a message goes through {@link #text} or {@link #attr}, so nothing read from the
 * repository can become markup.
 */
final class Html {
    private Html() {
    }

    /** Text for element content: {@code & < > " '} escaped. */
    static String text(String value) {
        StringBuilder out = new StringBuilder(value.length() + 16);
        for (int i = 0; i < value.length(); i++) {
            char c = value.charAt(i);
            switch (c) {
                case '&' -> out.append("&amp;");
                case '<' -> out.append("&lt;");
                case '>' -> out.append("&gt;");
                case '"' -> out.append("&quot;");
                case '\'' -> out.append("&#39;");
                default -> out.append(c);
            }
        }
        return out.toString();
    }

    /** A value for a double-quoted attribute. */
    static String attr(String value) {
        return text(value);
    }

    /**
     * Template text for the line view: escaped, with characters a reader cannot see (format and
     * control characters other than tab, and no-break spaces) shown as a labelled mark.
     */
    static String sourceText(String value) {
        StringBuilder out = new StringBuilder(value.length() + 16);
        for (int i = 0; i < value.length(); ) {
            int cp = value.codePointAt(i);
            int type = Character.getType(cp);
            boolean hidden = cp == 0x00A0 || cp == 0x202F || cp == 0xFEFF || type == Character.FORMAT
                    || (type == Character.CONTROL && cp != '\t');
            if (hidden) {
                String code = String.format(java.util.Locale.ROOT, "U+%04X", cp);
                out.append("<span class=\"hidden-char\" title=\"invisible character ").append(code).append("\">")
                        .append(code).append("</span>");
            } else {
                out.append(text(new String(Character.toChars(cp))));
            }
            i += Character.charCount(cp);
        }
        return out.toString();
    }

    /** A number as the JSON report writes it, for a {@code data-value} attribute. */
    static String value(double number) {
        return Double.toString(number);
    }

    /** A whole number for a {@code data-value} attribute. */
    static String value(long number) {
        return Long.toString(number);
    }

    /** An id fragment for a path: letters, digits and hyphens only. */
    static String id(String prefix, String path) {
        StringBuilder out = new StringBuilder(prefix).append('-');
        for (char c : path.toCharArray()) {
            out.append(Character.isLetterOrDigit(c) && c < 128 ? c : '-');
        }
        return out.append('-').append(Integer.toHexString(path.hashCode())).toString();
    }
}
