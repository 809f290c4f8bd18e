package org.pointcall.replay.archive;

/**
 * The end of an archive that was being written when the recording stopped hard: bytes after the last whole chunk.
 *
 * @param offset      where the cut bytes start (the end of the last whole chunk)
 * @param bytes       how many bytes are there and not read
 * @param records     records the cut chunk announced, or -1 when its header is cut too
 * @param firstTimeNs first record time of the cut chunk (archive clock), when {@code records >= 0}
 * @param lastTimeNs  last record time of the cut chunk, when {@code records >= 0}
 */
public record CutTail(long offset, long bytes, int records, long firstTimeNs, long lastTimeNs) {
    public CutTail {
        if (offset < 0 || bytes <= 0) {
            throw new IllegalArgumentException("a cut tail has a place and at least one byte");
        }
    }

    public boolean spanKnown() {
        return records >= 0;
    }

    /** One line for a user. */
    public String describe() {
        String s = bytes + " bytes cut at offset " + offset;
        if (spanKnown()) {
            return s + ": an unfinished chunk of " + records + " records spanning "
                    + String.format(java.util.Locale.ROOT, "%.3f s", (lastTimeNs - firstTimeNs) / 1e9)
                    + " (archive time " + firstTimeNs + " to " + lastTimeNs + " ns)";
        }
        return s + ": an unfinished chunk header, time span unknown";
    }
}
