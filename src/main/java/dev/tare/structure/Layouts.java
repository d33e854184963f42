package dev.tare.structure;

/**
 * Layout that Markdown does not know, found line by line: tab-separated columns, and text laid out
 * with spaces (columns that line up, scales, drawings). Such lines carry meaning in their
 * whitespace, so a safe rewrite leaves them byte for byte as they are.
 */
final class Layouts {
    private Layouts() {
    }

    /** Marks tab-separated and aligned lines among those not already code, HTML or a table. */
    static void mark(LineSpans lines, String text, Role[] roles) {
        int n = lines.count();
        int[] tabs = new int[n];
        for (int i = 0; i < n; i++) {
            tabs[i] = open(roles[i]) ? innerTabs(text, lines.start(i), lines.end(i)) : 0;
        }
        for (int i = 0; i < n; i++) {
            boolean neighbour = (i > 0 && tabs[i - 1] > 0) || (i + 1 < n && tabs[i + 1] > 0);
            // Two tabs anywhere on a line, even one with nothing else on it, may be a row of empty cells.
            boolean twoTabs = (open(roles[i]) || roles[i] == Role.BLANK) && allTabs(text, lines.start(i), lines.end(i)) >= 2;
            if (tabs[i] >= 2 || (tabs[i] == 1 && neighbour) || twoTabs) {
                roles[i] = Role.TAB_SEPARATED;
            }
        }
        int[][] gapEnds = new int[n][];
        boolean[] laidOut = new boolean[n];
        for (int i = 0; i < n; i++) {
            if (open(roles[i])) {
                gapEnds[i] = gapEnds(text, lines.start(i), lines.end(i), 2);
                laidOut[i] = drawn(text, lines.start(i), lines.end(i))
                        || gapEnds(text, lines.start(i), lines.end(i), 3).length > 0;
            }
        }
        for (int i = 0; i < n; i++) {
            if (gapEnds[i] != null && (laidOut[i] || linesUp(gapEnds, i, i - 1) || linesUp(gapEnds, i, i + 1))) {
                roles[i] = Role.ALIGNED;
            }
        }
    }

    /** Whether a line of this role may still turn out to be laid out. */
    private static boolean open(Role role) {
        return role != null && !role.isVerbatim() && role != Role.BLANK;
    }

    /** Tabs between two non-blank characters of the line (leading and trailing tabs are indentation and noise). */
    private static int innerTabs(String text, int start, int end) {
        int first = start;
        while (first < end && (text.charAt(first) == ' ' || text.charAt(first) == '\t')) {
            first++;
        }
        int last = end;
        while (last > first && (text.charAt(last - 1) == ' ' || text.charAt(last - 1) == '\t')) {
            last--;
        }
        int count = 0;
        for (int i = first; i < last; i++) {
            if (text.charAt(i) == '\t') {
                count++;
            }
        }
        return count;
    }

    private static int allTabs(String text, int start, int end) {
        int count = 0;
        for (int i = start; i < end; i++) {
            if (text.charAt(i) == '\t') {
                count++;
            }
        }
        return count;
    }

    /** Whether the line draws with box-drawing or block characters. */
    private static boolean drawn(String text, int start, int end) {
        for (int i = start; i < end; i++) {
            char c = text.charAt(i);
            if (c >= '\u2500' && c <= '\u259F') {
                return true;
            }
        }
        return false;
    }

    /** The columns (from the line's start) where runs of at least {@code width} spaces between words end. */
    private static int[] gapEnds(String text, int start, int end, int width) {
        int i = start;
        while (i < end && (text.charAt(i) == ' ' || text.charAt(i) == '\t')) {
            i++;
        }
        java.util.List<Integer> found = new java.util.ArrayList<>();
        while (i < end) {
            if (text.charAt(i) != ' ') {
                i++;
                continue;
            }
            int run = i;
            while (run < end && text.charAt(run) == ' ') {
                run++;
            }
            if (run < end && run - i >= width) {
                found.add(run - start);
            }
            i = run;
        }
        return found.stream().mapToInt(Integer::intValue).toArray();
    }

    /** Whether a gap of line {@code i} ends in the same column as a gap of line {@code j}: columns that line up. */
    private static boolean linesUp(int[][] gapEnds, int i, int j) {
        if (j < 0 || j >= gapEnds.length || gapEnds[j] == null) {
            return false;
        }
        for (int a : gapEnds[i]) {
            for (int b : gapEnds[j]) {
                if (a == b) {
                    return true;
                }
            }
        }
        return false;
    }
}
