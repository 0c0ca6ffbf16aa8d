package org.twinlight;

/**
 * The input was fine but the work could not be done (a fit that did not converge, no period
 * found). The message says why and what to try. Commands turn it into exit code 1.
 */
public class WorkFailedException extends RuntimeException {
    private static final long serialVersionUID = 1L;

    public WorkFailedException(String message) {
        super(message);
    }

    public WorkFailedException(String message, Throwable cause) {
        super(message, cause);
    }
}
