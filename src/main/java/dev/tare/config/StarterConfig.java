package dev.tare.config;

import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;

/** The commented starter {@code tare.yaml} that {@code tare init} writes. */
public final class StarterConfig {
    private StarterConfig() {
    }

    /** The starter file's text; it loads with {@link ConfigLoader} as it is. */
    public static String text() {
        try (InputStream in = StarterConfig.class.getResourceAsStream("starter-tare.yaml")) {
            if (in == null) {
                throw new IllegalStateException("starter-tare.yaml is missing from the build");
            }
            return new String(in.readAllBytes(), StandardCharsets.UTF_8);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }
}
