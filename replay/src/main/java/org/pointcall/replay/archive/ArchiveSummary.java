package org.pointcall.replay.archive;

import java.nio.ByteOrder;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.TreeMap;

import org.pointcall.ingest.wire.DecoderOptions;
import org.pointcall.ingest.wire.DictionaryRegistry;
import org.pointcall.ingest.wire.FaultLog;
import org.pointcall.ingest.wire.PacketDecoder;
import org.pointcall.ingest.wire.SequenceTotals;
import org.pointcall.shared.dictionary.DictionaryFiles;

/**
 * What a sortie archive holds, for a user: its span, chunks, packets by stream, records by type, damage, and what
 * decoding its packets gives (frames, packets lost on the link before they reached the recorder).
 */
public final class ArchiveSummary {
    private ArchiveSummary() {
    }

    /**
     * Reads the whole archive once.
     *
     * @param registry dictionaries known up front; those the archive's announces carry are learnt as it is decoded
     */
    public static List<String> lines(ArchiveReader r, DictionaryRegistry registry) {
        Map<Integer, long[]> streams = new TreeMap<>();
        Map<String, Long> types = new TreeMap<>();
        long[] packets = new long[2];
        long[] dictionaries = new long[1];
        List<String> faults = new ArrayList<>();
        PacketDecoder decoder = new PacketDecoder(registry, DictionaryFiles::parse, (id, f, t) -> { },
                DecoderOptions.DEFAULT.withMaxDatagramBytes(65_507), new FaultLog(faults::add, 5, 3_600_000_000_000L));
        r.read(v -> {
            switch (v.kind()) {
                case ArchiveFormat.KIND_PACKET -> {
                    packets[0]++;
                    packets[1] += v.body().remaining();
                    int id = v.body().remaining() >= 16
                            ? v.body().duplicate().order(ByteOrder.LITTLE_ENDIAN).getInt(v.body().position() + 12) : 0;
                    streams.computeIfAbsent(id, k -> new long[1])[0]++;
                    decoder.decode(v.body(), "archive record at " + v.timeNs() + " ns", v.timeNs());
                }
                case ArchiveFormat.KIND_DICTIONARY -> dictionaries[0]++;
                default -> types.merge(v.type(), 1L, Long::sum);
            }
            return true;
        });
        decoder.flushPending();
        List<String> out = new ArrayList<>();
        long t0 = r.firstTimeNs();
        long t1 = r.lastTimeNs();
        out.add(r.file() + ": sortie archive, created " + Instant.ofEpochMilli(r.createdEpochMs()));
        out.add(String.format(Locale.ROOT, "  span: %.3f s of arrival time, %d chunks, %d records%s",
                r.chunks().isEmpty() ? 0.0 : (t1 - t0) / 1e9, r.chunks().size(), r.records(),
                r.indexRebuilt() ? " (index rebuilt by scanning)" : ""));
        out.add("  packets: " + packets[0] + " (" + packets[1] + " bytes)");
        for (Map.Entry<Integer, long[]> e : streams.entrySet()) {
            out.add("    stream " + e.getKey() + ": " + e.getValue()[0] + " packets");
        }
        var c = decoder.counters();
        SequenceTotals s = decoder.sequenceTotals();
        out.add("  decoded: " + c.framesDelivered() + " frames (" + c.framesPartial() + " partial), "
                + c.dictionariesLearnt() + " dictionaries learnt, " + c.faults() + " bad packets, " + s.lost()
                + " packets lost before recording (sequence gaps)");
        out.add("  stored dictionaries: " + dictionaries[0]);
        if (types.isEmpty()) {
            out.add("  records: none");
        }
        for (Map.Entry<String, Long> e : types.entrySet()) {
            out.add("  records '" + e.getKey() + "': " + e.getValue());
        }
        out.addAll(r.healthLines());
        for (String f : faults) {
            out.add("  " + f);
        }
        return out;
    }
}
