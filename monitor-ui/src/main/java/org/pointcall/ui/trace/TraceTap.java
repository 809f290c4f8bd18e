package org.pointcall.ui.trace;

import java.util.List;

import org.pointcall.ingest.frame.Frame;
import org.pointcall.ingest.frame.FrameSink;
import org.pointcall.shared.dictionary.ParameterDictionary;
import org.pointcall.shared.error.PointcallException;

/**
 * Frame tap on the pipeline thread that copies the charted parameters of each frame into a {@link SampleRing},
 * under the layout the screen selected last ({@link TraceFeed#select}), whose number goes with every sample. Per
 * frame it costs one volatile read and a handful of array stores, and it never waits for the screen. Values are
 * in the dictionary's engineering units, as the charts show them.
 */
public final class TraceTap implements FrameSink {
    private final SampleRing ring;
    private final TraceFeed feed;

    /** @param parameters charted at first; each must be in the dictionary */
    public TraceTap(ParameterDictionary dictionary, List<String> parameters, int capacity) {
        this.ring = new SampleRing(TraceFeed.MAX_LANES + 1, capacity);
        try {
            this.feed = new TraceFeed(dictionary, parameters, ring);
        } catch (IllegalArgumentException e) {
            throw new PointcallException("charts: " + e.getMessage(), e);
        }
    }

    /** The ring with its layout, for the charts. */
    public TraceFeed feed() {
        return feed;
    }

    public List<String> parameters() {
        return feed.parameters();
    }

    public SampleRing ring() {
        return ring;
    }

    @Override
    public void onFrame(Frame frame) {
        TraceFeed.Layout l = feed.layout();
        ring.write(frame.timeNs(), l.number(), frame.values(), l.slots());
    }
}
