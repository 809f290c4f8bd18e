package org.pointcall.ui.demo;

import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.TimeUnit;
import java.util.function.Consumer;

import org.pointcall.replay.archive.ArchiveReader;
import org.pointcall.replay.play.ArchiveSource;
import org.pointcall.replay.play.ReplayClock;
import org.pointcall.replay.play.ReplayControl;
import org.pointcall.replay.play.ReplayState;
import org.pointcall.replay.play.ReplayTargets;
import org.pointcall.replay.play.Replayer;
import org.pointcall.shared.card.TestCard;
import org.pointcall.shared.dictionary.ParameterDictionary;
import org.pointcall.ui.desk.DeskCommand;
import org.pointcall.ui.desk.DeskLink;
import org.pointcall.ui.desk.PointSpan;
import org.pointcall.ui.desk.TransportState;
import org.pointcall.ui.settings.ConsoleSettings;
import org.pointcall.ui.trace.TraceFeed;
import org.pointcall.ui.trace.TraceTap;

/**
 * A recorded sortie played into the console's live side (pipeline, card session, charts), with the console's
 * transport: play, pause, speed, seek and jump to a point, forward and back.
 *
 * <p>What the screen shows after any jump is what it would have shown live at that moment: a jump forward plays
 * everything in between as fast as the pipeline takes it ({@link ReplayControl#catchUpTo}), so the points, verdicts
 * and alarms on the way are seen; a jump back starts a fresh session (new pipeline, card session and desk on the
 * same link and chart feed, so the window stays as it is) and catches up from the recording's start to the
 * target. A long sortie takes a moment to catch up (the replay runs a few hundred times real time without the
 * analysis; less with it); the transport says it is catching up meanwhile. The engineer's own calls made during
 * a replay belong to that pass and are not carried over a jump back.
 */
public final class ReplayDeck implements SessionDesk.TransportSide, AutoCloseable {
    /** A jump to a point lands this long before it began, so that its entry is seen. */
    public static final double JUMP_LEAD_S = 5.0;

    private final ArchiveReader reader;
    private final TestCard card;
    private final ParameterDictionary dictionary;
    private final LiveConsole.SessionFactory sessions;
    private final Consumer<String> faults;
    private final DeskLink link = new DeskLink();
    private final TraceTap tap;
    private final long startNs;
    private final double lengthS;
    private final ExecutorService rewinds = Executors.newSingleThreadExecutor(r -> {
        Thread t = new Thread(r, "replay-rewind");
        t.setDaemon(true);
        return t;
    });
    private volatile Pass pass;
    /** The transport steered now: set before its pass starts, so that the pass's publisher always finds one. */
    private volatile ReplayControl current;

    /** One pass through the recording: its live side, transport and replay thread. */
    private record Pass(LiveConsole live, ReplayControl control, Thread player) {
    }

    public ReplayDeck(ArchiveReader reader, TestCard card, ParameterDictionary dictionary, ConsoleSettings settings,
                      LiveConsole.SessionFactory sessions, Consumer<String> faults) {
        this.reader = reader;
        this.card = card;
        this.dictionary = dictionary;
        this.sessions = sessions;
        this.faults = faults;
        this.tap = LiveConsole.tapFor(dictionary, settings, faults);
        this.startNs = reader.firstTimeNs();
        this.lengthS = Math.max(0, (reader.lastTimeNs() - startNs) / 1e9);
    }

    /** Starts the first pass from the recording's start. */
    public void start(double speed, boolean paused) {
        pass = startPass(new ReplayControl(speed, paused));
    }

    private Pass startPass(ReplayControl control) {
        current = control;
        SessionDesk desk = new SessionDesk(card, dictionary);
        desk.transport(this);
        LiveConsole live = new LiveConsole(0, link, tap, desk, sessions, null, faults, false);
        live.start();
        Thread player = new Thread(() -> new Replayer(new ArchiveSource(reader),
                ReplayTargets.pipeline(live.rig().pipeline()), ReplayClock.SYSTEM, control).run(), "replay");
        player.setDaemon(true);
        player.start();
        return new Pass(live, control, player);
    }

    public DeskLink link() {
        return link;
    }

    public TraceFeed traces() {
        return tap.feed();
    }

    /** The current pass's live side (it changes at a jump back). */
    public LiveConsole live() {
        return pass.live();
    }

    /** The current pass's transport. */
    public ReplayControl control() {
        return current;
    }

    @Override
    public TransportState state() {
        ReplayControl control = current;
        long p = control.positionNs();
        double pos = p == Long.MIN_VALUE ? 0 : Math.max(0, (p - startNs) / 1e9);
        double speed = Double.isInfinite(control.speed()) ? ReplayControl.MAX_PACED : control.speed();
        long c = control.catchingUpTo();
        double catchUp = c == Long.MIN_VALUE ? Double.NaN : Math.min(lengthS, (c - startNs) / 1e9);
        return new TransportState(control.state() == ReplayState.PLAYING, speed, Math.min(pos, lengthS), lengthS,
                catchUp);
    }

    /** Publisher thread. */
    @Override
    public void accept(DeskCommand c) {
        ReplayControl control = current;
        if (c instanceof DeskCommand.PlayPause p) {
            if (p.play()) {
                control.play();
            } else {
                control.pause();
            }
        } else if (c instanceof DeskCommand.Speed s) {
            control.speed(Math.max(ReplayControl.MIN_PACED, Math.min(ReplayControl.MAX_PACED, s.speed())));
        } else if (c instanceof DeskCommand.Seek s) {
            go(startNs + Math.round(Math.max(0, Math.min(lengthS, s.positionS())) * 1e9));
        } else if (c instanceof DeskCommand.JumpToPoint j) {
            Double begin = pointBeginS(j.pointId());
            if (begin == null) {
                throw new IllegalArgumentException("point " + j.pointId() + " has not been seen in this replay yet");
            }
            go(Math.max(startNs, Math.round((begin - JUMP_LEAD_S) * 1e9)));
        }
    }

    /** Goes to archive time {@code targetNs}: on by catching up, or back by a fresh pass that catches up to it. */
    private void go(long targetNs) {
        ReplayControl control = current;
        long pos = control.positionNs();
        if (pos == Long.MIN_VALUE || targetNs >= pos) {
            control.catchUpTo(targetNs);
            return;
        }
        rewinds.execute(() -> rewind(targetNs));
    }

    /** Rewind thread: ends the current pass and starts a new one from the start, caught up to the target. */
    private void rewind(long targetNs) {
        Pass old = pass;
        ReplayControl c = new ReplayControl(old.control().speed(), old.control().state() == ReplayState.PAUSED);
        c.catchUpTo(targetNs);
        current = c; // the transport shows the jump at once, and keys pressed meanwhile steer the new pass
        old.control().stop();
        try {
            old.player().join(10_000);
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            return;
        }
        old.live().close();
        pass = startPass(c);
    }

    /**
     * Archive time (s, the packets' clock) at which a point began, or null when not seen yet. Archive time is
     * arrival time and a point's begin is data time; the two are mapped by what has been played so far (a sortie
     * recorded at 4x has four seconds of data per archive second).
     */
    private Double pointBeginS(String id) {
        Pass p = pass;
        long d0 = p.live().clock().firstNs();
        long dNow = p.live().clock().timeNs();
        long aNow = p.control().positionNs();
        if (d0 == Long.MIN_VALUE || aNow == Long.MIN_VALUE) {
            return null;
        }
        double ratio = dNow > d0 ? (double) (aNow - startNs) / (dNow - d0) : 1.0;
        for (PointSpan s : p.live().desk().spans()) {
            if (s.pointId().equals(id)) {
                return (startNs + (s.beginS() * 1e9 - d0) * ratio) / 1e9;
            }
        }
        return null;
    }

    /** Stops the replay and the live side; waits for a jump back in progress. */
    @Override
    public void close() {
        rewinds.shutdown();
        try {
            rewinds.awaitTermination(15, TimeUnit.SECONDS);
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
        }
        Pass p = pass;
        if (p == null) {
            return;
        }
        p.control().stop();
        try {
            p.player().join(5000);
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
        }
        p.live().close();
    }
}
