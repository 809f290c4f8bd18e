package org.pointcall.ingest.wire;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;

import java.nio.ByteBuffer;
import java.nio.charset.StandardCharsets;
import java.util.Arrays;
import java.util.zip.CRC32C;

import org.junit.jupiter.api.Test;

/** The byte layout WIRE-FORMAT.md documents, checked byte by byte. */
class LayoutTest {
    private static final StreamIdentity ID = new StreamIdentity(7, 0x01020304, 0x1122334455667788L, 3);

    private static byte[] bytes(ByteBuffer b) {
        byte[] p = new byte[b.remaining()];
        b.get(p);
        return p;
    }

    private static int[] u8(byte[] p, int from, int to) {
        int[] out = new int[to - from];
        for (int i = from; i < to; i++) {
            out[i - from] = p[i] & 0xff;
        }
        return out;
    }

    @Test
    void crc32cIsTheCastagnoliCrc() {
        // check value of CRC-32C (CRC-32/ISCSI) over the ASCII "123456789", from the CRC catalogue [memory]
        CRC32C c = new CRC32C();
        c.update("123456789".getBytes(StandardCharsets.US_ASCII));
        assertEquals(0xE3069283L, c.getValue());
    }

    @Test
    void framesPacketFieldsSitWhereTheDocumentSays() {
        PacketEncoder enc = new PacketEncoder(1472);
        byte[] p = bytes(enc.encodeFrames(ID, WireFormat.FLAG_SYNTHETIC, 0x0A0B0C0D, 42, new long[] {1000, 1500},
                new double[] {1.0, -2.0, Double.NaN, 0.5, 0.25, 0.125}, 2, 0, 3));
        assertEquals(56 + 4 + 2 * 3 * 8 + 4, p.length);
        assertArrayEquals(new int[] {'P', 'C', 'L', 'W', 1, 1, 2, 0}, u8(p, 0, 8));
        assertArrayEquals(new int[] {112, 0, 0, 0}, u8(p, 8, 12), "length, little-endian");
        assertArrayEquals(new int[] {7, 0, 0, 0, 4, 3, 2, 1, 0x0D, 0x0C, 0x0B, 0x0A}, u8(p, 12, 24));
        assertArrayEquals(new int[] {0x88, 0x77, 0x66, 0x55, 0x44, 0x33, 0x22, 0x11, 3, 0}, u8(p, 24, 34));
        assertArrayEquals(new int[] {2, 0, 0, 0, 3, 0}, u8(p, 34, 40), "frame count, first slot, part slots");
        assertArrayEquals(new int[] {42, 0, 0, 0, 0, 0, 0, 0}, u8(p, 40, 48), "first frame index");
        assertArrayEquals(new int[] {0xE8, 3, 0, 0, 0, 0, 0, 0}, u8(p, 48, 56), "first frame time 1000 ns");
        assertArrayEquals(new int[] {0xF4, 1, 0, 0}, u8(p, 56, 60), "offset of frame 1: 500 ns");
        // IEEE 754 binary64 of 1.0 is 0x3FF0000000000000, here little-endian
        assertArrayEquals(new int[] {0, 0, 0, 0, 0, 0, 0xF0, 0x3F}, u8(p, 60, 68));
        CRC32C c = new CRC32C();
        c.update(p, 0, p.length - 4);
        assertEquals((int) c.getValue(), ByteBuffer.wrap(p).order(WireFormat.ORDER).getInt(p.length - 4));
    }

    @Test
    void announcePacketFieldsSitWhereTheDocumentSays() {
        PacketEncoder enc = new PacketEncoder(68); // the smallest limit: 12 text bytes a fragment
        byte[] text = "abcdefghijklmnopqrstuvwxyz0123".getBytes(StandardCharsets.US_ASCII);
        int crc = PacketEncoder.textCrc(text);
        byte[] p = bytes(enc.encodeAnnounce(ID, 0, 9, text, crc, 1));
        assertEquals(68, p.length);
        assertArrayEquals(new int[] {'P', 'C', 'L', 'W', 1, 2, 0, 0}, u8(p, 0, 8));
        assertArrayEquals(new int[] {1, 0, 3, 0, 0, 0}, u8(p, 34, 40), "fragment 1 of 3, reserved");
        assertArrayEquals(new int[] {30, 0, 0, 0, 12, 0, 0, 0}, u8(p, 40, 48), "text length 30, offset 12");
        assertEquals(crc, ByteBuffer.wrap(p).order(WireFormat.ORDER).getInt(48));
        assertArrayEquals("mnopqrstuvwx".getBytes(StandardCharsets.US_ASCII), Arrays.copyOfRange(p, 52, 64));
    }
}
