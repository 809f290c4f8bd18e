package org.pointcall.replay.record;

/** What a recorder alarm is about. */
public enum AlarmKind {
    /** The recorder fell behind and its queue was full: packets were not recorded. */
    QUEUE_OVERFLOW,
    /** A packet longer than the recorder takes was not recorded. */
    OVERSIZE,
    /** The archive could not be written (disk full, device gone...): data is held in memory. */
    WRITE_FAILED,
    /** The memory held while writes fail is full: the oldest held data was given up. */
    MEMORY_FULL,
    /** Writing works again; what was held went to disk. */
    WRITING_AGAIN
}
