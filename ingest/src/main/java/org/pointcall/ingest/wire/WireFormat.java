package org.pointcall.ingest.wire;

import java.nio.ByteOrder;

/**
 * Layout of the pointcall wire format, version 1 (ingest/WIRE-FORMAT.md is the prose version). Every multi-byte
 * field is little-endian. Offsets are from the first byte of the datagram.
 */
public final class WireFormat {
    /** The bytes 'P' 'C' 'L' 'W' on the wire, read as a little-endian int. */
    public static final int MAGIC = 0x574C4350;
    public static final int VERSION = 1;
    public static final ByteOrder ORDER = ByteOrder.LITTLE_ENDIAN;

    public static final int TYPE_FRAMES = 1;
    public static final int TYPE_ANNOUNCE = 2;

    /** Frames packet: values are float32 instead of float64. */
    public static final int FLAG_FLOAT32 = 1;
    /** Any packet: the stream comes from a simulator or replay. */
    public static final int FLAG_SYNTHETIC = 1 << 1;
    static final int FRAMES_FLAGS = FLAG_FLOAT32 | FLAG_SYNTHETIC;
    static final int ANNOUNCE_FLAGS = FLAG_SYNTHETIC;

    // common header
    static final int OFF_MAGIC = 0;
    static final int OFF_VERSION = 4;
    static final int OFF_TYPE = 5;
    static final int OFF_FLAGS = 6;
    static final int OFF_LENGTH = 8;
    static final int OFF_STREAM = 12;
    static final int OFF_EPOCH = 16;
    static final int OFF_SEQUENCE = 20;
    static final int OFF_DICT_HASH = 24;
    static final int OFF_DICT_SLOTS = 32;
    /** Bytes common to every packet type. */
    public static final int COMMON_HEADER_BYTES = 34;

    // frames packet
    static final int OFF_FRAME_COUNT = 34;
    static final int OFF_FIRST_SLOT = 36;
    static final int OFF_PART_SLOTS = 38;
    static final int OFF_FIRST_INDEX = 40;
    static final int OFF_FIRST_TIME = 48;
    public static final int FRAMES_HEADER_BYTES = 56;

    // announce packet
    static final int OFF_FRAGMENT_INDEX = 34;
    static final int OFF_FRAGMENT_COUNT = 36;
    static final int OFF_RESERVED = 38;
    static final int OFF_TEXT_LENGTH = 40;
    static final int OFF_FRAGMENT_OFFSET = 44;
    static final int OFF_TEXT_CRC = 48;
    public static final int ANNOUNCE_HEADER_BYTES = 52;

    public static final int TRAILER_BYTES = 4;
    /** Shortest datagram that can be this format at all: a common header and the CRC trailer. */
    public static final int MIN_PACKET_BYTES = COMMON_HEADER_BYTES + TRAILER_BYTES;

    /** Ethernet MTU 1500 less the IPv4 header (20) and the UDP header (8): the largest datagram sent unfragmented. */
    public static final int DEFAULT_MAX_DATAGRAM_BYTES = 1500 - 20 - 8;
    /** 65,535 (IPv4 total length) less the IPv4 and UDP headers: no UDP datagram over IPv4 can be larger. */
    public static final int MAX_UDP_PAYLOAD_BYTES = 65_535 - 20 - 8;
    /** Smallest maximum that still carries one frame of one float64 slot. */
    public static final int MIN_MAX_DATAGRAM_BYTES = FRAMES_HEADER_BYTES + 8 + TRAILER_BYTES;

    /** 16-bit fields bound the slots per dictionary, frames per packet and fragments per announce. */
    public static final int MAX_U16 = 0xFFFF;

    private WireFormat() {
    }

    /** Bytes of one value in a frames packet with these flags. */
    public static int valueBytes(int flags) {
        return (flags & FLAG_FLOAT32) != 0 ? 4 : 8;
    }

    /** Exact length of a frames packet. */
    public static long framesPacketBytes(int frameCount, int partSlots, int valueBytes) {
        return FRAMES_HEADER_BYTES + 4L * (frameCount - 1) + (long) frameCount * partSlots * valueBytes
                + TRAILER_BYTES;
    }

    /** Widest slot range of a single frame that fits one datagram of {@code maxDatagramBytes}. */
    public static int maxSlotsPerPart(int maxDatagramBytes, int valueBytes) {
        return Math.min(MAX_U16, (maxDatagramBytes - FRAMES_HEADER_BYTES - TRAILER_BYTES) / valueBytes);
    }

    /** Whole frames of {@code slots} values that fit one datagram; 0 when one frame must be split into parts. */
    public static int framesPerPacket(int maxDatagramBytes, int slots, int valueBytes) {
        // n frames need 4(n - 1) + n * slots * valueBytes body bytes
        long body = maxDatagramBytes - FRAMES_HEADER_BYTES - TRAILER_BYTES;
        long n = (body + 4) / (4L + (long) slots * valueBytes);
        return (int) Math.min(n, MAX_U16);
    }

    /** Text bytes one announce fragment carries at this maximum datagram size. */
    public static int announceChunkBytes(int maxDatagramBytes) {
        return maxDatagramBytes - ANNOUNCE_HEADER_BYTES - TRAILER_BYTES;
    }

    static void checkMaxDatagram(int maxDatagramBytes) {
        if (maxDatagramBytes < MIN_MAX_DATAGRAM_BYTES || maxDatagramBytes > MAX_UDP_PAYLOAD_BYTES) {
            throw new IllegalArgumentException("maximum datagram size must be within [" + MIN_MAX_DATAGRAM_BYTES
                    + ", " + MAX_UDP_PAYLOAD_BYTES + "] bytes, got " + maxDatagramBytes);
        }
    }
}
