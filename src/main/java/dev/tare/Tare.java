package dev.tare;

import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.util.Properties;

/** Facts about this build of Tare that every output carries. */
public final class Tare {
    /** The version, then {@code +} and the time the build was made (semantic versioning's build metadata). */
    private static final String IDENTITY = identity();
    private static final String VERSION = IDENTITY.substring(0, IDENTITY.indexOf('+'));

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
        return IDENTITY;
    }

    /**
     * From the jar's manifest ({@code Implementation-Version}, which the build writes as version +
     * build time) when Tare runs from its jar: the class-data archive holds the manifest, so a run
     * whose classes all come from the archive need not open the jar at all. From
     * {@code version.properties} when it runs from a build's classes folder.
     */
    private static String identity() {
        String manifest = Tare.class.getPackage().getImplementationVersion();
        if (manifest != null && manifest.indexOf('+') > 0) {
            return manifest;
        }
        Properties properties = new Properties();
        try (InputStream in = Tare.class.getResourceAsStream("version.properties")) {
            if (in != null) {
                properties.load(in);
            }
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        return properties.getProperty("version", "unknown") + "+" + properties.getProperty("build", "unknown");
    }
}
