package org.pointcall.ui.share;

import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.locks.LockSupport;
import java.util.function.Consumer;

import org.pointcall.ingest.derive.DerivedParameters;
import org.pointcall.ingest.frame.Frame;
import org.pointcall.ingest.kafka.KafkaSettings;
import org.pointcall.ingest.pipeline.IngestMetrics;
import org.pointcall.ingest.wire.StreamFrameSink;
import org.pointcall.shared.card.TestCard;
import org.pointcall.shared.dictionary.ParameterDictionary;
import org.pointcall.shared.outcome.SessionEvent;
import org.pointcall.ui.demo.DataClock;
import org.pointcall.ui.demo.DeskPublisher;
import org.pointcall.ui.demo.HealthReader;
import org.pointcall.ui.desk.DeskLink;
import org.pointcall.ui.trace.TraceFeed;

import io.micrometer.core.instrument.MeterRegistry;
import io.micrometer.core.instrument.Timer;
import io.micrometer.core.instrument.simple.SimpleMeterRegistry;

/**
 * A watching console, wired: the {@link WatchFeed} (its own thread: frames decoded, derived parameters computed as
 * the first session computes them, the data clock and the chart tap; session records into the {@link WatchDesk}),
 * and the snapshot publisher on its own thread. The window, if any, attaches to {@link #link()} and
 * {@link #traces}. Stream health is the feed's: frames decoded, sequence gaps and losses as this watcher sees them,
 * and latency from the first session's receipt of each packet to here (by the two machines' wall clocks).
 */
public final class WatchConsole implements AutoCloseable {
    /** About 16 s of 1,000 samples/s, as a live console. */
    static final int RING_SAMPLES = 1 << 14;
    public static final String SOURCE = "watch";

    private final DeskLink link = new DeskLink();
    private final DataClock clock = new DataClock();
    private final MeterRegistry meters = new SimpleMeterRegistry();
    private final Timer latency = IngestMetrics.latencyTimer(meters, SOURCE);
    private final WatchDesk desk;
    private final WatchFeed feed;
    private final DeskPublisher publisher;
    private final List<String> charted;
    private volatile WatchTap tap;

    /**
     * @param charted the parameters to chart (their lanes are made at the first session's dictionary), or null
     *                for no charts
     * @param also    told everything the desk is told, after it (a headless printer), or null
     * @param notes   plain lines for the user
     */
    public WatchConsole(KafkaSettings settings, double backfillS, List<String> charted, WatchFeed.Listener also,
                        Consumer<String> notes) {
        this.charted = charted == null ? null : List.copyOf(charted);
        desk = new WatchDesk(ShareAddress.describe(settings), clock::timeNs);
        WatchFeed.Listener listener = new WatchFeed.Listener() {
            @Override
            public void onStart(ShareRecords.SessionStart start, TestCard card, ParameterDictionary dictionary) {
                if (tap == null && WatchConsole.this.charted != null) {
                    tap = new WatchTap(dictionary, WatchConsole.this.charted, RING_SAMPLES);
                }
                desk.onStart(start, card, dictionary);
                if (also != null) {
                    also.onStart(start, card, dictionary);
                }
            }

            @Override
            public void onEvent(SessionEvent event) {
                desk.onEvent(event);
                if (also != null) {
                    also.onEvent(event);
                }
            }

            @Override
            public void onView(ShareRecords.ActiveView view) {
                desk.onView(view);
                if (also != null) {
                    also.onView(view);
                }
            }

            @Override
            public void onFault(String line) {
                desk.onFault(line);
                if (also != null) {
                    also.onFault(line);
                }
            }
        };
        StreamFrameSink frames = new StreamFrameSink() {
            private final Map<Integer, DerivedParameters> derived = new HashMap<>();

            @Override
            public void onDictionary(int streamId, ParameterDictionary dictionary) {
                derived.put(streamId, DerivedParameters.bind(dictionary));
                WatchTap t = tap;
                if (t != null) {
                    t.bind(dictionary);
                }
            }

            @Override
            public void onFrame(int streamId, Frame frame, long receiveTimeNs) {
                DerivedParameters d = derived.get(streamId);
                if (d != null) {
                    d.apply(frame);
                }
                clock.onFrame(frame);
                WatchTap t = tap;
                if (t != null) {
                    t.onFrame(frame);
                }
                latency.record(System.nanoTime() - receiveTimeNs, TimeUnit.NANOSECONDS);
            }
        };
        feed = new WatchFeed(settings, backfillS, frames, listener, notes);
        IngestMetrics.bindDecoder(meters, SOURCE, feed.decoder());
        publisher = new DeskPublisher(link, desk, new HealthReader(meters), clock::timeCs);
    }

    public void start() {
        feed.start();
        publisher.start();
    }

    /** Waits until a session is followed (its start record read); false when {@code timeoutNs} passed first. */
    public boolean awaitSession(long timeoutNs) {
        long end = System.nanoTime() + timeoutNs;
        while (desk.start() == null) {
            if (System.nanoTime() - end > 0) {
                return false;
            }
            LockSupport.parkNanos(20_000_000L);
        }
        return true;
    }

    /** The chart feed (after {@link #awaitSession}; null when made without charted parameters). */
    public TraceFeed traces() {
        WatchTap t = tap;
        return t == null ? null : t.feed();
    }

    public DeskLink link() {
        return link;
    }

    public WatchDesk desk() {
        return desk;
    }

    public WatchFeed feed() {
        return feed;
    }

    public DataClock clock() {
        return clock;
    }

    @Override
    public void close() {
        feed.close();
        publisher.close();
        publisher.publishOnce(System.nanoTime());
    }
}
