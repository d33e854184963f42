package dev.tare.template;

import dev.tare.TareException;
import java.util.Arrays;
import java.util.Locale;
import java.util.stream.Collectors;

/**
 * Whether lines such as {@code system:} and {@code user:} split a text template into chat messages
 * ({@code templates.roles} in {@code tare.yaml}).
 */
public enum RoleMarkers {
    /** A text template with role marker lines is a chat template, one message per marker. */
    AUTO("auto"),
    /** Every text template is one plain text, marker lines included. */
    OFF("off");

    private final String label;

    RoleMarkers(String label) {
        this.label = label;
    }

    /** The name used in {@code tare.yaml}. */
    public String label() {
        return label;
    }

    /**
     * The setting called {@code label} in configuration.
     *
     * @throws TareException naming the accepted values when there is none
     */
    public static RoleMarkers fromLabel(String label) {
        String wanted = label.trim().toLowerCase(Locale.ROOT);
        return Arrays.stream(values())
                .filter(markers -> markers.label.equals(wanted))
                .findFirst()
                .orElseThrow(() -> new TareException("unknown roles setting '" + label + "': use one of "
                        + Arrays.stream(values()).map(RoleMarkers::label).collect(Collectors.joining(", "))));
    }
}
