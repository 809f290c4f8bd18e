package org.pointcall.ingest.wire;

import java.nio.ByteBuffer;
import java.util.Arrays;

/** Fragments of one announce being put back together. Buffer grows with the fragments, not with the claim. */
final class AnnounceAssembly {
    private static final int INITIAL_BYTES = 1 << 16;

    final long hash;
    final int textLength;
    final int textCrc;
    final int fragmentCount;
    final int dictionarySlots;
    private final long[] got;
    private byte[] bytes;
    int fragmentsGot;
    long bytesGot;

    AnnounceAssembly(long hash, int textLength, int textCrc, int fragmentCount, int dictionarySlots) {
        this.hash = hash;
        this.textLength = textLength;
        this.textCrc = textCrc;
        this.fragmentCount = fragmentCount;
        this.dictionarySlots = dictionarySlots;
        this.got = new long[(fragmentCount + 63) >>> 6];
        this.bytes = new byte[Math.min(textLength, INITIAL_BYTES)];
    }

    boolean matches(long h, int length, int crc, int count, int slots) {
        return h == hash && length == textLength && crc == textCrc && count == fragmentCount
                && slots == dictionarySlots;
    }

    /** Stores one fragment; true when this completed the set. A fragment seen before is ignored. */
    boolean add(int index, ByteBuffer src, int at, int n, int offset) {
        long m = 1L << (index & 63);
        if ((got[index >>> 6] & m) != 0) {
            return false;
        }
        got[index >>> 6] |= m;
        int end = offset + n;
        if (end > bytes.length) {
            int size = bytes.length;
            while (size < end) {
                size = (int) Math.min((long) size * 2, textLength);
            }
            bytes = Arrays.copyOf(bytes, size);
        }
        src.get(at, bytes, offset, n);
        fragmentsGot++;
        bytesGot += n;
        return fragmentsGot == fragmentCount;
    }

    byte[] bytes() {
        return bytes;
    }
}
