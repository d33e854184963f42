package dev.tare.calibrate;

import java.util.List;

/**
 * The usable samples of a usage log and, for every line that was not usable, why.
 *
 * @param file     the log as the user named it
 * @param samples  usable samples, in file order
 * @param problems one message per unusable line, {@code line N: reason}
 */
public record UsageLog(String file, List<UsageSample> samples, List<String> problems) {
    public UsageLog {
        samples = List.copyOf(samples);
        problems = List.copyOf(problems);
    }
}
