package org.pointcall.ingest.wire;

/**
 * What every packet of one sender session of one stream repeats in its header.
 *
 * @param streamId        sender-chosen stream number
 * @param epoch           sender session: a new value at each sender start, so a receiver tells a restart from a
 *                        late packet (see {@link StreamTracker})
 * @param dictionaryHash  {@code ParameterDictionary.hash()} of the stream's slot layout
 * @param dictionarySlots slots in that dictionary, 1 to 65,535
 */
public record StreamIdentity(int streamId, int epoch, long dictionaryHash, int dictionarySlots) {
    public StreamIdentity {
        if (dictionarySlots < 1 || dictionarySlots > WireFormat.MAX_U16) {
            throw new IllegalArgumentException("a dictionary on the wire has 1 to 65535 slots, got " + dictionarySlots);
        }
    }
}
