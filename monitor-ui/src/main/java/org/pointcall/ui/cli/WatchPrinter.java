package org.pointcall.ui.cli;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicLong;
import java.util.concurrent.atomic.AtomicReference;

import org.pointcall.ingest.frame.Frame;
import org.pointcall.ingest.kafka.KafkaSettings;
import org.pointcall.ingest.wire.StreamFrameSink;
import org.pointcall.models.card.SessionMirror;
import org.pointcall.shared.card.TestCard;
import org.pointcall.shared.dictionary.ParameterDictionary;
import org.pointcall.shared.outcome.PointOutcome;
import org.pointcall.shared.outcome.PointsFiles;
import org.pointcall.shared.outcome.SessionEvent;
import org.pointcall.ui.share.ShareAddress;
import org.pointcall.ui.share.ShareRecords;
import org.pointcall.ui.share.WatchFeed;

/**
 * {@code monitor --headless --watch}: follows a shared session and prints its lines as the first monitor printed
 * them, from the beginning of the session; at the end the points as the first session judged them (and, with
 * {@code --out}, its points files, rebuilt from its events).
 */
final class WatchPrinter {
    private final KafkaSettings settings;
    private final Double untilIdleS;
    private final Path out;
    private final PrintWriter w;
    private final AtomicReference<SessionMirror> mirror = new AtomicReference<>();
    private final AtomicLong frames = new AtomicLong();
    private final AtomicLong lastFrameNs = new AtomicLong(Long.MIN_VALUE);
    private boolean stopped;

    WatchPrinter(KafkaSettings settings, Double untilIdleS, Path out, PrintWriter w) {
        this.settings = settings;
        this.untilIdleS = untilIdleS;
        this.out = out;
        this.w = w;
    }

    int run() throws InterruptedException {
        StreamFrameSink sink = new StreamFrameSink() {
            @Override
            public void onFrame(int streamId, Frame frame, long receiveTimeNs) {
                frames.incrementAndGet();
                lastFrameNs.set(frame.timeNs());
            }

            @Override
            public void onDictionary(int streamId, ParameterDictionary dictionary) {
            }
        };
        WatchFeed feed = new WatchFeed(settings, 0, sink, new WatchFeed.Listener() {
            @Override
            public void onStart(ShareRecords.SessionStart start, TestCard card, ParameterDictionary dictionary) {
                mirror.set(new SessionMirror(card));
                say("watching: sortie " + card.sortie() + " (" + card.points().size() + " points), "
                        + start.source() + ", session " + start.session() + "; read-only");
            }

            @Override
            public void onEvent(SessionEvent event) {
                SessionMirror m = mirror.get();
                if (m != null) {
                    m.onEvent(event);
                }
                say(event.line());
            }

            @Override
            public void onView(ShareRecords.ActiveView view) {
                SessionMirror m = mirror.get();
                if (m != null) {
                    m.onView(view.active());
                }
            }

            @Override
            public void onFault(String line) {
                say("fault: " + line);
            }
        }, this::say);
        Thread stopper = new Thread(() -> stop(feed), "watch-stop");
        Runtime.getRuntime().addShutdownHook(stopper);
        feed.start();
        say("watching " + ShareAddress.describe(settings) + ": the session's events from its beginning; "
                + "the tool proposes, the test team decides");
        while (true) {
            TimeUnit.MILLISECONDS.sleep(100);
            long last = feed.lastRecordNs();
            if (untilIdleS != null && last != Long.MIN_VALUE && feed.caughtUp()
                    && System.nanoTime() - last > untilIdleS * 1e9) {
                break;
            }
        }
        Runtime.getRuntime().removeShutdownHook(stopper);
        stop(feed);
        return 0;
    }

    private synchronized void stop(WatchFeed feed) {
        if (stopped) {
            return;
        }
        stopped = true;
        feed.close();
        WatchFeed.Counts c = feed.counts();
        SessionMirror m = mirror.get();
        if (m == null) {
            say("no shared session found on " + ShareAddress.describe(settings));
        } else {
            List<PointOutcome> points = m.outcomes();
            for (PointOutcome o : points) {
                say("point: " + (o.cardId() == null ? "unplanned " + o.kind() : o.cardId()) + " "
                        + (o.verdict() == null ? "-" : o.verdict().key().toUpperCase(java.util.Locale.ROOT))
                        + (o.operatorCall() == null ? "" : " (called " + o.finalCall().key() + " by the engineer)"));
            }
            if (out != null) {
                List<Path> written = PointsFiles.write(out, m.pointsFile("watched on "
                        + ShareAddress.describe(settings)));
                say("wrote: " + written.get(0) + ", " + written.get(1));
            }
        }
        say("stopped: " + c.sessionRecords() + " session records, " + c.frameRecords() + " frame records ("
                + frames.get() + " frames of the followed stream), " + c.bad() + " skipped"
                + (c.badByKind().isEmpty() ? "" : " " + c.badByKind()) + ", " + c.otherSessions()
                + " of other sessions");
    }

    private void say(String line) {
        synchronized (w) {
            w.println(line);
            w.flush();
        }
    }
}
