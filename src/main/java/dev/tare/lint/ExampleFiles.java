package dev.tare.lint;

import java.util.LinkedHashMap;
import java.util.Map;

/**
 * The files of an example that spans several templates: each file starts with a line
 * {@code >>> path} and runs up to the next such line, the line break before it included.
 */
public final class ExampleFiles {
    /** What starts a file's header line. */
    public static final String MARK = ">>> ";

    private ExampleFiles() {
    }

    /** Whether {@code text} is written as several files. */
    public static boolean isFileSet(String text) {
        return text.startsWith(MARK);
    }

    /** The files of {@code text} by path, in order. */
    public static Map<String, String> parse(String text) {
        Map<String, String> files = new LinkedHashMap<>();
        String path = null;
        StringBuilder body = new StringBuilder();
        for (String line : text.split("(?<=\n)")) {
            if (line.startsWith(MARK)) {
                if (path != null) {
                    files.put(path, body.toString());
                }
                path = line.substring(MARK.length()).strip();
                body.setLength(0);
            } else if (path != null) {
                body.append(line);
            } else {
                throw new IllegalArgumentException("an example of several files must start with '" + MARK + "path'");
            }
        }
        if (path != null) {
            files.put(path, body.toString());
        }
        return files;
    }

    /** {@code files} written back in this form. */
    public static String format(Map<String, String> files) {
        StringBuilder out = new StringBuilder();
        files.forEach((path, text) -> out.append(MARK).append(path).append('\n').append(text));
        return out.toString();
    }
}
