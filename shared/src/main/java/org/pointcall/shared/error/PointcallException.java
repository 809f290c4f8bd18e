package org.pointcall.shared.error;

/**
 * Root of every error a user may see. Its message is one plain line that says where and what, and the command line
 * prints only that line (exit code 2), never a stack trace.
 */
public class PointcallException extends RuntimeException {
    private static final long serialVersionUID = 1L;

    public PointcallException(String message) {
        super(message);
    }

    public PointcallException(String message, Throwable cause) {
        super(message, cause);
    }
}
