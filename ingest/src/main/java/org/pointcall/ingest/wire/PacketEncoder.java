package org.pointcall.ingest.wire;

import java.nio.ByteBuffer;
import java.util.zip.CRC32C;

/**
 * Writes single packets of the wire format into one reusable buffer: nothing is allocated per packet. Most callers
 * want {@link StreamEncoder}, which batches frames, splits wide ones into parts and numbers the packets.
 *
 * <p>Arguments that would make a packet this format cannot carry (too big for the datagram limit, a time offset
 * outside int32) are programming errors and throw {@link IllegalArgumentException}. Not thread-safe.
 */
public final class PacketEncoder {
    private final int maxDatagramBytes;
    private final ByteBuffer buf;
    private final CRC32C crc = new CRC32C();

    public PacketEncoder(int maxDatagramBytes) {
        WireFormat.checkMaxDatagram(maxDatagramBytes);
        this.maxDatagramBytes = maxDatagramBytes;
        this.buf = ByteBuffer.allocate(maxDatagramBytes).order(WireFormat.ORDER);
    }

    public int maxDatagramBytes() {
        return maxDatagramBytes;
    }

    /**
     * Encodes frames {@code [0, frameCount)} of a batch, slots {@code [firstSlot, firstSlot + partSlots)} of each.
     *
     * @param values row-major batch: slot {@code s} of frame {@code i} is {@code values[i * dictionarySlots + s]}
     * @param timesNs frame times; each must lie within int32 nanoseconds of {@code timesNs[0]}
     * @param firstFrameIndex sender's running index of frame 0 of the batch
     * @return the buffer, position 0 and limit the packet length; valid until the next call
     */
    public ByteBuffer encodeFrames(StreamIdentity id, int flags, int sequence, long firstFrameIndex, long[] timesNs,
                                   double[] values, int frameCount, int firstSlot, int partSlots) {
        int slots = id.dictionarySlots();
        if ((flags & ~WireFormat.FRAMES_FLAGS) != 0) {
            throw new IllegalArgumentException("unknown frames flags 0x" + Integer.toHexString(flags));
        }
        if (frameCount < 1 || partSlots < 1 || firstSlot < 0 || firstSlot + partSlots > slots) {
            throw new IllegalArgumentException("bad batch: " + frameCount + " frames, slots [" + firstSlot + ", "
                    + (firstSlot + partSlots) + ") of " + slots);
        }
        if (partSlots < slots && frameCount != 1) {
            throw new IllegalArgumentException("a packet carrying part of a frame carries exactly one frame");
        }
        int valueBytes = WireFormat.valueBytes(flags);
        long length = WireFormat.framesPacketBytes(frameCount, partSlots, valueBytes);
        if (length > maxDatagramBytes) {
            throw new IllegalArgumentException(frameCount + " frames of " + partSlots + " slots need " + length
                    + " bytes, more than the " + maxDatagramBytes + "-byte datagram limit");
        }
        buf.clear();
        putCommon(WireFormat.TYPE_FRAMES, flags, (int) length, id, sequence);
        buf.putShort(WireFormat.OFF_FRAME_COUNT, (short) frameCount);
        buf.putShort(WireFormat.OFF_FIRST_SLOT, (short) firstSlot);
        buf.putShort(WireFormat.OFF_PART_SLOTS, (short) partSlots);
        buf.putLong(WireFormat.OFF_FIRST_INDEX, firstFrameIndex);
        long t0 = timesNs[0];
        buf.putLong(WireFormat.OFF_FIRST_TIME, t0);
        int at = WireFormat.FRAMES_HEADER_BYTES;
        for (int i = 1; i < frameCount; i++) {
            long offset = timesNs[i] - t0;
            if (offset != (int) offset) {
                throw new IllegalArgumentException("frame " + i + " lies " + offset
                        + " ns from the first frame of its packet, outside int32");
            }
            buf.putInt(at, (int) offset);
            at += 4;
        }
        boolean float32 = valueBytes == 4;
        for (int i = 0; i < frameCount; i++) {
            int row = i * slots + firstSlot;
            for (int s = 0; s < partSlots; s++) {
                if (float32) {
                    buf.putFloat(at, (float) values[row + s]);
                } else {
                    buf.putDouble(at, values[row + s]);
                }
                at += valueBytes;
            }
        }
        return seal(at);
    }

    /**
     * Encodes fragment {@code fragmentIndex} of an announce carrying {@code text} (the dictionary as UTF-8).
     *
     * @param textCrc CRC-32C of the whole text, from {@link #textCrc(byte[])}
     */
    public ByteBuffer encodeAnnounce(StreamIdentity id, int flags, int sequence, byte[] text, int textCrc,
                                     int fragmentIndex) {
        if ((flags & ~WireFormat.ANNOUNCE_FLAGS) != 0) {
            throw new IllegalArgumentException("unknown announce flags 0x" + Integer.toHexString(flags));
        }
        int count = announceFragments(text.length);
        if (fragmentIndex < 0 || fragmentIndex >= count) {
            throw new IllegalArgumentException("fragment " + fragmentIndex + " of " + count);
        }
        int chunk = WireFormat.announceChunkBytes(maxDatagramBytes);
        int offset = fragmentIndex * chunk;
        int n = Math.min(chunk, text.length - offset);
        int length = WireFormat.ANNOUNCE_HEADER_BYTES + n + WireFormat.TRAILER_BYTES;
        buf.clear();
        putCommon(WireFormat.TYPE_ANNOUNCE, flags, length, id, sequence);
        buf.putShort(WireFormat.OFF_FRAGMENT_INDEX, (short) fragmentIndex);
        buf.putShort(WireFormat.OFF_FRAGMENT_COUNT, (short) count);
        buf.putShort(WireFormat.OFF_RESERVED, (short) 0);
        buf.putInt(WireFormat.OFF_TEXT_LENGTH, text.length);
        buf.putInt(WireFormat.OFF_FRAGMENT_OFFSET, offset);
        buf.putInt(WireFormat.OFF_TEXT_CRC, textCrc);
        buf.position(WireFormat.ANNOUNCE_HEADER_BYTES);
        buf.put(text, offset, n);
        return seal(WireFormat.ANNOUNCE_HEADER_BYTES + n);
    }

    /** Fragments an announce of {@code textBytes} needs at this encoder's datagram limit. */
    public int announceFragments(int textBytes) {
        if (textBytes < 1) {
            throw new IllegalArgumentException("an announce carries at least one byte of text");
        }
        int chunk = WireFormat.announceChunkBytes(maxDatagramBytes);
        int count = (textBytes + chunk - 1) / chunk;
        if (count > WireFormat.MAX_U16) {
            throw new IllegalArgumentException("dictionary text of " + textBytes + " bytes needs " + count
                    + " fragments, more than 65535; raise the datagram limit");
        }
        return count;
    }

    /** CRC-32C of a whole announce text, as carried in every fragment. */
    public static int textCrc(byte[] text) {
        CRC32C c = new CRC32C();
        c.update(text, 0, text.length);
        return (int) c.getValue();
    }

    private void putCommon(int type, int flags, int length, StreamIdentity id, int sequence) {
        buf.putInt(WireFormat.OFF_MAGIC, WireFormat.MAGIC);
        buf.put(WireFormat.OFF_VERSION, (byte) WireFormat.VERSION);
        buf.put(WireFormat.OFF_TYPE, (byte) type);
        buf.putShort(WireFormat.OFF_FLAGS, (short) flags);
        buf.putInt(WireFormat.OFF_LENGTH, length);
        buf.putInt(WireFormat.OFF_STREAM, id.streamId());
        buf.putInt(WireFormat.OFF_EPOCH, id.epoch());
        buf.putInt(WireFormat.OFF_SEQUENCE, sequence);
        buf.putLong(WireFormat.OFF_DICT_HASH, id.dictionaryHash());
        buf.putShort(WireFormat.OFF_DICT_SLOTS, (short) id.dictionarySlots());
    }

    private ByteBuffer seal(int bodyEnd) {
        crc.reset();
        buf.position(0).limit(bodyEnd);
        crc.update(buf);
        buf.limit(bodyEnd + WireFormat.TRAILER_BYTES);
        buf.putInt(bodyEnd, (int) crc.getValue());
        buf.position(0);
        return buf;
    }
}
