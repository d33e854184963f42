package dev.tare.cli;

/** The exit codes scripts rely on. */
public final class ExitCodes {
    /** Everything ran and nothing failed a gate. */
    public static final int OK = 0;
    /** Findings at or above the failing severity, or a budget or baseline breach. */
    public static final int FINDINGS = 1;
    /**
     * {@code fix}: a file was not fixed (its rewrite failed verification or did not settle, it changed on
     * disk after it was read, or writing it failed); that file was left as it was.
     */
    public static final int NOT_FIXED = 1;
    /** A usage, configuration or input error: the message says what to fix. */
    public static final int USAGE = 2;
    /** A bug in Tare; {@code --debug} shows the stack trace. */
    public static final int INTERNAL = 3;

    private ExitCodes() {
    }
}
