package dev.tare.report;

import java.util.ArrayList;
import java.util.List;

/** A plain-text table with a header row, left-aligned text columns and right-aligned number columns. */
final class TextTable {
    private final List<String> headers;
    private final boolean[] numeric;
    private final List<List<String>> rows = new ArrayList<>();
    private final List<Integer> rules = new ArrayList<>();

    TextTable(List<String> headers, boolean... numeric) {
        this.headers = headers;
        this.numeric = numeric;
    }

    void row(List<String> cells) {
        rows.add(cells);
    }

    /** A horizontal rule before the next row. */
    void rule() {
        rules.add(rows.size());
    }

    String render() {
        int[] widths = new int[headers.size()];
        for (int c = 0; c < widths.length; c++) {
            widths[c] = headers.get(c).length();
            for (List<String> row : rows) {
                widths[c] = Math.max(widths[c], row.get(c).length());
            }
        }
        StringBuilder out = new StringBuilder();
        line(out, headers, widths);
        separator(out, widths);
        for (int r = 0; r < rows.size(); r++) {
            if (rules.contains(r)) {
                separator(out, widths);
            }
            line(out, rows.get(r), widths);
        }
        return out.toString();
    }

    private void line(StringBuilder out, List<String> cells, int[] widths) {
        StringBuilder line = new StringBuilder();
        for (int c = 0; c < cells.size(); c++) {
            String cell = cells.get(c);
            String pad = " ".repeat(widths[c] - cell.length());
            boolean right = c < numeric.length && numeric[c];
            line.append(right ? pad + cell : cell + pad);
            if (c + 1 < cells.size()) {
                line.append("  ");
            }
        }
        out.append(line.toString().stripTrailing()).append('\n');
    }

    private static void separator(StringBuilder out, int[] widths) {
        int total = 0;
        for (int width : widths) {
            total += width;
        }
        out.append("-".repeat(total + 2 * (widths.length - 1))).append('\n');
    }

    static String number(long value) {
        return String.format(java.util.Locale.ROOT, "%,d", value);
    }
}
