package dev.tare;

import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.util.Properties;

/** Facts about this build of Tare that every output carries. */
public final class Tare {
    private static final String VERSION = loadVersion();

    private Tare() {
    }

    /** The version of this build, as written into JSON and SARIF output. */
    public static String version() {
        return VERSION;
    }

    private static String loadVersion() {
        try (InputStream in = Tare.class.getResourceAsStream("version.properties")) {
            if (in == null) {
                return "unknown";
            }
            Properties properties = new Properties();
            properties.load(in);
            return properties.getProperty("version", "unknown");
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }
}
