package dev.tare;

import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.util.Properties;

/** Facts about this build of Tare that every output carries. */
public final class Tare {
    private static final Properties BUILD = load();
    private static final String VERSION = BUILD.getProperty("version", "unknown");

    private Tare() {
    }

    /** The version of this build, as written into JSON and SARIF output. */
    public static String version() {
        return VERSION;
    }

    /**
     * The version and the time this build was made: what a cache of results must match, since two
     * builds of one development version can count differently.
     */
    public static String buildIdentity() {
        return VERSION + " " + BUILD.getProperty("build", "unknown");
    }

    private static Properties load() {
        Properties properties = new Properties();
        try (InputStream in = Tare.class.getResourceAsStream("version.properties")) {
            if (in != null) {
                properties.load(in);
            }
            return properties;
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }
}
