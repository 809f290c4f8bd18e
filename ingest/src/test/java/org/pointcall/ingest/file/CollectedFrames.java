package org.pointcall.ingest.file;

import java.util.ArrayList;
import java.util.List;

import org.pointcall.ingest.frame.Frame;
import org.pointcall.ingest.frame.FrameSink;

/** A sink that keeps a copy of every frame, since sources reuse theirs. */
final class CollectedFrames implements FrameSink {
    final List<Frame> frames = new ArrayList<>();
    private Frame last;
    private boolean sameInstance = true;

    @Override
    public void onFrame(Frame frame) {
        if (last != null && last != frame) {
            sameInstance = false;
        }
        last = frame;
        frames.add(frame.copy());
    }

    Frame get(int i) {
        return frames.get(i);
    }

    int size() {
        return frames.size();
    }

    /** True when the source handed the same Frame object every time. */
    boolean reusedOneFrame() {
        return sameInstance;
    }

    long[] times() {
        long[] t = new long[frames.size()];
        for (int i = 0; i < t.length; i++) {
            t[i] = frames.get(i).timeNs();
        }
        return t;
    }

    long[] sequences() {
        long[] s = new long[frames.size()];
        for (int i = 0; i < s.length; i++) {
            s[i] = frames.get(i).sequence();
        }
        return s;
    }

    double[] values(int slot) {
        double[] v = new double[frames.size()];
        for (int i = 0; i < v.length; i++) {
            v[i] = frames.get(i).value(slot);
        }
        return v;
    }
}
