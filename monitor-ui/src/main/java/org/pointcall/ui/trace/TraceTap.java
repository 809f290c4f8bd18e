package org.pointcall.ui.trace;

import java.util.List;

import org.pointcall.ingest.frame.Frame;
import org.pointcall.ingest.frame.FrameSink;
import org.pointcall.shared.dictionary.ParameterDictionary;
import org.pointcall.shared.error.PointcallException;

/**
 * Frame tap on the pipeline thread that copies the charted parameters of each frame into a {@link SampleRing}.
 * Slots are resolved once, here; per frame it costs a handful of array stores and never waits for the screen.
 * Values are in the dictionary's engineering units, as the charts show them.
 */
public final class TraceTap implements FrameSink {
    private final List<String> parameters;
    private final int[] slots;
    private final SampleRing ring;
    private final TraceFeed feed;

    public TraceTap(ParameterDictionary dictionary, List<String> parameters, int capacity) {
        this.parameters = List.copyOf(parameters);
        this.slots = new int[this.parameters.size()];
        for (int i = 0; i < slots.length; i++) {
            String p = this.parameters.get(i);
            slots[i] = dictionary.indexOf(p);
            if (slots[i] < 0) {
                throw new PointcallException("chart parameter '" + p + "' is not in the dictionary '"
                        + dictionary.name() + "'");
            }
        }
        this.ring = new SampleRing(slots.length, capacity);
        List<String> units = new java.util.ArrayList<>();
        for (int slot : slots) {
            units.add(dictionary.parameters().get(slot).unit().symbol());
        }
        this.feed = new TraceFeed(this.parameters, units, ring);
    }

    /** The ring with its channel names and units, for the charts. */
    public TraceFeed feed() {
        return feed;
    }

    public List<String> parameters() {
        return parameters;
    }

    public SampleRing ring() {
        return ring;
    }

    @Override
    public void onFrame(Frame frame) {
        ring.write(frame.timeNs(), frame.values(), slots);
    }
}
