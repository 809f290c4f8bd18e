package org.pointcall.ingest.wire;

import java.nio.ByteBuffer;
import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;
import java.util.zip.CRC32C;

import org.pointcall.ingest.frame.Frame;

/** Seeded frame generators and small helpers shared by the wire tests. */
final class WireTestSupport {
    private WireTestSupport() {
    }

    /**
     * Random frames: values from arbitrary bit patterns (NaNs with payloads, infinities, subnormals) mixed with
     * ordinary numbers and plain NaN; times irregular, now and then repeating, stepping back, or jumping further
     * than an int32 offset reaches.
     */
    static List<Frame> randomFrames(SplittableRandom r, int slots, int n, long startNs) {
        List<Frame> out = new ArrayList<>(n);
        long t = startNs;
        for (int i = 0; i < n; i++) {
            Frame f = new Frame(slots);
            for (int s = 0; s < slots; s++) {
                int kind = r.nextInt(10);
                double v;
                if (kind == 0) {
                    v = Double.NaN;
                } else if (kind == 1) {
                    v = Double.longBitsToDouble(r.nextLong());
                } else {
                    v = (r.nextDouble() - 0.5) * Math.pow(10, r.nextInt(-6, 7));
                }
                f.value(s, v);
            }
            int step = r.nextInt(100);
            if (step == 0) {
                t += 3_000_000_000L + r.nextInt(1_000_000); // beyond an int32 offset from the packet's first frame
            } else if (step == 1) {
                t -= r.nextInt(5_000_000); // time steps back
            } else if (step != 2) { // step 2 repeats the time
                t += 1_000_000 + r.nextInt(80_000_000); // irregular 1 to 81 ms
            }
            f.timeNs(t);
            out.add(f);
        }
        return out;
    }

    static ByteBuffer wrap(byte[] packet) {
        return ByteBuffer.wrap(packet);
    }

    static ByteBuffer wrapAt(byte[] packet, int prefix, SplittableRandom r) {
        byte[] big = new byte[prefix + packet.length + r.nextInt(8)];
        r.nextBytes(big);
        System.arraycopy(packet, 0, big, prefix, packet.length);
        ByteBuffer b = ByteBuffer.wrap(big);
        b.position(prefix).limit(prefix + packet.length);
        return b;
    }

    /** Recomputes the CRC trailer after a header edit, so the edit gets past the CRC check. */
    static void reseal(byte[] p) {
        CRC32C c = new CRC32C();
        c.update(p, 0, p.length - 4);
        ByteBuffer.wrap(p).order(WireFormat.ORDER).putInt(p.length - 4, (int) c.getValue());
    }
}
