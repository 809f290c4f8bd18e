package org.pointcall.replay.play;

import static org.junit.jupiter.api.Assertions.*;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.atomic.AtomicReference;

import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.pointcall.replay.archive.ArchiveReader;

class ReplayerTest {
    @TempDir
    Path dir;
    Path file;
    TestArchives data;
    final ManualClock clock = new ManualClock(5_000_000_000L);
    final List<Long> playedAt = new ArrayList<>();
    final List<Long> playedData = new ArrayList<>();

    @BeforeEach
    void archive() throws Exception {
        file = dir.resolve("a.pcsa");
        data = TestArchives.w1(file, 400, 200);
    }

    private ReplaySummary play(ReplayControl control, java.util.function.IntConsumer onPacket) {
        try (ArchiveReader r = ArchiveReader.open(file)) {
            ReplayTarget t = (p, dataNs) -> {
                playedAt.add(clock.nowNs());
                playedData.add(dataNs);
                onPacket.accept(playedAt.size() - 1);
            };
            return new Replayer(new ArchiveSource(r), t, clock, control).run();
        }
    }

    @Test
    void eachPacketGoesOutWhenItsDataTimeIsDueAtTheSpeedAsked() {
        for (double speed : new double[] {0.1, 1, 2.5, 100}) {
            playedAt.clear();
            playedData.clear();
            ReplaySummary s = play(new ReplayControl(speed, false), i -> { });
            assertEquals(data.packets.size(), s.packets());
            assertEquals(data.times, playedData);
            long t0 = playedData.get(0);
            long c0 = playedAt.get(0);
            long prev = c0;
            for (int i = 0; i < playedAt.size(); i++) {
                // the manual clock moves by exactly the waits asked for: the schedule is met to the nanosecond; a
                // packet whose arrival jitter puts it before the one ahead of it is already due and goes at once
                long due = Math.max(prev, c0 + (long) ((playedData.get(i) - t0) / speed));
                assertEquals(due, playedAt.get(i), "packet " + i);
                prev = due;
            }
            assertEquals(speed, s.speed(), speed * 1e-6);
        }
    }

    @Test
    void aCatchUpPlaysEverythingBeforeItsTimeAtOnceThenPacesFromThere() {
        int k = data.times.size() / 2;
        long until = data.times.get(k);
        ReplayControl control = new ReplayControl(2, false);
        control.catchUpTo(until);
        ReplaySummary s = play(control, i -> { });
        assertEquals(data.packets.size(), s.packets(), "nothing is skipped by a catch-up");
        assertEquals(data.times, playedData);
        long c0 = playedAt.get(0);
        int firstPaced = 0;
        while (data.times.get(firstPaced) < until) {
            assertEquals(c0, playedAt.get(firstPaced), "packet " + firstPaced + " is before the catch-up's end");
            firstPaced++;
        }
        long cK = playedAt.get(firstPaced);
        long prev = cK;
        for (int i = firstPaced; i < playedAt.size(); i++) {
            long due = Math.max(prev, cK + (long) ((playedData.get(i) - until) / 2));
            assertEquals(due, playedAt.get(i), "packet " + i + " is paced at 2x from the catch-up's end");
            prev = due;
        }
        assertTrue(playedAt.get(playedAt.size() - 1) > c0, "the paced half took time");
        assertEquals(Long.MIN_VALUE, control.catchingUpTo(), "the catch-up is over");
    }

    @Test
    void atMaxSpeedNothingWaits() {
        ReplaySummary s = play(new ReplayControl(ReplayControl.MAX_SPEED, false), i -> { });
        assertEquals(data.packets.size(), s.packets());
        assertEquals(0, s.elapsedNs());
    }

    @Test
    void pauseHoldsTheReplayAndResumingAtANewSpeedReanchorsOnThePosition() throws Exception {
        ReplayControl control = new ReplayControl(1, false);
        AtomicReference<Throwable> bad = new AtomicReference<>();
        Thread console = new Thread(() -> {
            try {
                assertTrue(control.awaitState(ReplayState.PAUSED, 10_000));
                clock.advance(7_000_000_000L); // time passes while paused
                control.speed(4);
                control.play();
            } catch (Throwable e) {
                bad.set(e);
            }
        });
        console.start();
        long[] pausedAtClock = new long[1];
        ReplaySummary s = play(control, i -> {
            if (i == 100) {
                pausedAtClock[0] = clock.nowNs(); // before pausing: the console moves the clock once paused
                control.pause();
            }
        });
        console.join();
        assertNull(bad.get());
        assertEquals(data.packets.size(), s.packets());
        long resumedAt = pausedAtClock[0] + 7_000_000_000L;
        long prev = resumedAt;
        for (int i = 101; i < playedAt.size(); i++) {
            long due = Math.max(prev, resumedAt + (long) ((playedData.get(i) - playedData.get(100)) / 4.0));
            assertEquals(due, playedAt.get(i), "packet " + i);
            prev = due;
        }
    }

    @Test
    void jumpingToAStoredEventPlaysOnFromItsTime() {
        long eventNs;
        try (ArchiveReader r = ArchiveReader.open(file)) {
            List<Long> points = new ArchiveSource(r).pointsOf("event");
            assertEquals(1, points.size());
            eventNs = points.get(0);
        }
        ReplayControl control = new ReplayControl(ReplayControl.MAX_SPEED, false);
        ReplaySummary s = play(control, i -> {
            if (i == 10) {
                control.seek(eventNs);
            }
        });
        int first = 0;
        while (data.times.get(first) < eventNs) {
            first++;
        }
        assertEquals(1, s.seeks());
        assertEquals(11 + data.packets.size() - first, s.packets());
        assertEquals(data.times.get(first), playedData.get(11));
        assertEquals(data.times.get(10), playedData.get(10));
    }

    @Test
    void seekingBackReplaysFromThereAndStopEndsAtOnce() {
        ReplayControl control = new ReplayControl(2, false);
        long back = data.times.get(50);
        boolean[] done = new boolean[1];
        ReplaySummary s = play(control, i -> {
            if (i == 300 && !done[0]) {
                done[0] = true;
                control.seek(back);
            }
            if (i == 400) {
                control.stop();
            }
        });
        assertTrue(s.stopped());
        assertEquals(401, s.packets());
        assertEquals(back, playedData.get(301));
        assertEquals(ReplayState.STOPPED, control.state());
    }

    @Test
    void speedsOutsideTheRangeAreRefusedWithTheRangeNamed() {
        assertEquals(ReplayControl.MAX_SPEED, ReplayControl.parseSpeed("max"));
        assertEquals(20.0, ReplayControl.parseSpeed("20x"));
        var e = assertThrows(IllegalArgumentException.class, () -> ReplayControl.parseSpeed("0.05"));
        assertTrue(e.getMessage().contains("0.1 to 100"));
        assertThrows(IllegalArgumentException.class, () -> ReplayControl.parseSpeed("fast"));
        assertThrows(IllegalArgumentException.class, () -> new ReplayControl(101, false));
    }
}
