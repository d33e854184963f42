package dev.tare;

/**
 * An error the user can cause and fix: a bad flag, a broken config file, an unreadable template.
 * Its message names the file (and line where known) and says what to do; the CLI prints it on one
 * line and exits with code 2, without a stack trace unless {@code --debug} is given.
 */
public class TareException extends RuntimeException {
    private static final long serialVersionUID = 1L;

    public TareException(String message) {
        super(message);
    }

    public TareException(String message, Throwable cause) {
        super(message, cause);
    }
}
