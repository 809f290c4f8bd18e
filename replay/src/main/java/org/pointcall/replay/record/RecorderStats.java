package org.pointcall.replay.record;

/**
 * What a recorder has done so far.
 *
 * @param packetsTaken       packets taken from the queue into chunks
 * @param packetsWritten     packets in chunks written to the archive
 * @param droppedQueueFull   packets not recorded because the queue was full (the recorder fell behind)
 * @param droppedOversize    packets not recorded because they were longer than the recorder takes
 * @param lostDiskFull       packets given up while the disk refused writes and memory was full
 * @param records            typed and dictionary records taken
 * @param chunksWritten      chunks written
 * @param bytesWritten       archive bytes, file header included
 * @param heldBytes          sealed chunks held in memory, not yet written
 * @param writeFailures      writes refused by the file system
 */
public record RecorderStats(long packetsTaken, long packetsWritten, long droppedQueueFull, long droppedOversize,
                            long lostDiskFull, long records, long chunksWritten, long bytesWritten, long heldBytes,
                            long writeFailures) {
    /** Packets offered that are not in the archive (nor on their way to it). */
    public long notRecorded() {
        return droppedQueueFull + droppedOversize + lostDiskFull;
    }
}
