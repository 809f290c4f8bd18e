package org.pointcall.replay.record;

import static org.junit.jupiter.api.Assertions.*;

import java.net.InetSocketAddress;
import java.nio.ByteBuffer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.CopyOnWriteArrayList;
import java.util.concurrent.CountDownLatch;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicBoolean;
import java.util.concurrent.atomic.AtomicLong;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.pointcall.ingest.udp.SenderTags;
import org.pointcall.replay.archive.ArchiveReader;
import org.pointcall.replay.archive.TypedRecord;

class RecorderTest {
    @TempDir
    Path dir;

    @Test
    void everyPacketIsKeptAsReceivedWithItsArrivalTimeAndSender() {
        AtomicLong clock = new AtomicLong(1_000);
        List<RecorderAlarm> alarms = new CopyOnWriteArrayList<>();
        Path file = dir.resolve("r.pcsa");
        List<byte[]> sent = new ArrayList<>();
        InetSocketAddress from = new InetSocketAddress("127.0.0.1", 40123);
        try (Recorder rec = Recorder.start(file, RecorderPolicy.DEFAULT.withMaxChunkBytes(16 << 10), clock::get,
                alarms::add)) {
            W1Feed feed = new W1Feed(1, p -> {
                byte[] b = new byte[p.remaining()];
                p.get(p.position(), b);
                sent.add(b);
                rec.onDatagram(p, from, 5_000L + sent.size());
            });
            rec.recordDictionary(feed.dictionary(), feed.dictionaryText());
            for (int k = 0; k < 500; k++) {
                feed.step();
                if (k == 250) {
                    rec.appendRecord("call", 42L, "{\"call\":\"GOOD\"}".getBytes(StandardCharsets.UTF_8));
                }
            }
        }
        assertTrue(alarms.isEmpty(), alarms.toString());
        try (ArchiveReader r = ArchiveReader.open(file)) {
            List<byte[]> back = new ArrayList<>();
            List<Long> t = new ArrayList<>();
            r.read(v -> {
                if (v.isPacket()) {
                    back.add(v.bodyBytes());
                    t.add(v.timeNs());
                    assertEquals("127.0.0.1:40123", SenderTags.format(v.extra()));
                }
                return true;
            });
            assertEquals(sent.size(), back.size());
            for (int i = 0; i < sent.size(); i++) {
                assertArrayEquals(sent.get(i), back.get(i));
                assertEquals(5_001L + i, t.get(i));
            }
            List<TypedRecord> calls = r.typedRecords("call");
            assertEquals(1, calls.size());
            assertEquals(42L, calls.get(0).dataTimeNs());
            assertEquals(1_000L, calls.get(0).timeNs(), "stamped with the recorder clock when taken");
            assertEquals("{\"call\":\"GOOD\"}", calls.get(0).jsonText());
            assertEquals(1, r.dictionaries().size());
            assertTrue(r.chunks().size() > 10);
        }
    }

    @Test
    void aRecorderThatFallsBehindNeverBlocksTheReceiverAndCountsAndAlarmsWhatItDropped() throws Exception {
        // The recorder thread reads its clock every turn: a clock that blocks holds the recorder still, so the
        // queue fills exactly.
        AtomicBoolean hold = new AtomicBoolean(false);
        CountDownLatch held = new CountDownLatch(1);
        CountDownLatch release = new CountDownLatch(1);
        AtomicLong t = new AtomicLong();
        List<RecorderAlarm> alarms = new CopyOnWriteArrayList<>();
        Path file = dir.resolve("slow.pcsa");
        RecorderPolicy policy = RecorderPolicy.DEFAULT.withQueuePackets(64);
        Recorder rec = Recorder.start(file, policy, () -> {
            if (hold.get()) {
                held.countDown();
                try {
                    release.await();
                } catch (InterruptedException e) {
                    Thread.currentThread().interrupt();
                }
            }
            return t.incrementAndGet();
        }, alarms::add);
        hold.set(true);
        assertTrue(held.await(10, TimeUnit.SECONDS));
        ByteBuffer p = ByteBuffer.wrap(new byte[100]);
        int accepted = 0;
        for (int i = 0; i < 64 + 25; i++) {
            if (rec.offer(p, i)) {
                accepted++;
            }
        }
        assertEquals(64, accepted, "the queue takes what it holds and refuses the rest at once");
        hold.set(false);
        release.countDown();
        rec.close();
        RecorderStats s = rec.stats();
        assertEquals(25, s.droppedQueueFull());
        assertEquals(64, s.packetsWritten());
        assertEquals(1, alarms.size(), alarms.toString());
        assertEquals(AlarmKind.QUEUE_OVERFLOW, alarms.get(0).kind());
        assertTrue(alarms.get(0).message().contains("25 packets not recorded"), alarms.get(0).message());
    }

    @Test
    void anArchiveIsNeverOverwritten() {
        Path file = dir.resolve("once.pcsa");
        Recorder.start(file, RecorderPolicy.DEFAULT, System::nanoTime, a -> { }).close();
        var e = assertThrows(org.pointcall.shared.error.PointcallException.class,
                () -> Recorder.start(file, RecorderPolicy.DEFAULT, System::nanoTime, a -> { }));
        assertTrue(e.getMessage().contains("never overwritten"), e.getMessage());
    }

    @Test
    void aPolicyOutsideItsLimitsIsRefused() {
        assertThrows(IllegalArgumentException.class, () -> RecorderPolicy.DEFAULT.withMaxChunkAgeNs(0));
        assertThrows(IllegalArgumentException.class, () -> RecorderPolicy.DEFAULT.withMemoryLimitBytes(10));
    }
}
