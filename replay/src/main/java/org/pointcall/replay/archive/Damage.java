package org.pointcall.replay.archive;

/**
 * A stretch of an archive that could not be read and was skipped.
 *
 * @param offset  file offset where it starts
 * @param bytes   its length
 * @param message one line naming the offset and what was wrong
 */
public record Damage(long offset, long bytes, String message) {
    public Damage {
        if (offset < 0 || bytes < 0 || message == null || message.isBlank()) {
            throw new IllegalArgumentException("damage needs an offset, a length and a message");
        }
    }

    @Override
    public String toString() {
        return message;
    }
}
