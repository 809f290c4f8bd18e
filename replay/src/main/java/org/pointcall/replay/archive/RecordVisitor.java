package org.pointcall.replay.archive;

/** Receives the records of an archive in file order. */
@FunctionalInterface
public interface RecordVisitor {
    /** @return false to stop reading */
    boolean onRecord(RecordView record);
}
