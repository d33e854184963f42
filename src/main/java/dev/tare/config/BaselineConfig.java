package dev.tare.config;

/**
 * Where recorded footprints are kept and how much growth is tolerated.
 *
 * @param file             the baseline file, relative to the root
 * @param tolerancePercent growth above this percentage fails {@code check}
 */
public record BaselineConfig(String file, double tolerancePercent) {
    /** The baseline settings when none are configured. */
    public static final BaselineConfig DEFAULT = new BaselineConfig("tare-baseline.json", 5.0);
}
