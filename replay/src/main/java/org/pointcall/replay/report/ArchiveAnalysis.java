package org.pointcall.replay.report;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

import org.pointcall.ingest.frame.Frame;
import org.pointcall.ingest.wire.DecodeCounters;
import org.pointcall.ingest.wire.DictionaryRegistry;
import org.pointcall.ingest.wire.PacketDecoder;
import org.pointcall.ingest.wire.SequenceTotals;
import org.pointcall.ingest.wire.StreamFrameSink;
import org.pointcall.models.card.CardAnalysers;
import org.pointcall.models.card.CardSession;
import org.pointcall.models.card.SessionSetup;
import org.pointcall.models.modelfile.ModelDescription;
import org.pointcall.models.train.Classifier;
import org.pointcall.replay.archive.ArchiveReader;
import org.pointcall.replay.archive.RecordView;
import org.pointcall.shared.card.TestCard;
import org.pointcall.shared.dictionary.DictionaryFiles;
import org.pointcall.shared.dictionary.ParameterDictionary;
import org.pointcall.shared.error.PointcallException;
import org.pointcall.shared.outcome.PointsFile;
import org.pointcall.shared.outcome.PointsFiles;
import org.pointcall.shared.outcome.SessionEvent;

/**
 * Reads a sortie archive once for a report: every packet decoded as received (in arrival order, on the packets'
 * arrival times) into the card session of the first stream, with the engineer's arms and calls recorded in the
 * archive as session-event records ({@link PointsFiles#eventFromJson}) applied at their place in the stream, so the
 * report carries the calls taken live. Data quality adds the decoder's counts and the archive's own health (damaged
 * chunks, a cut end).
 */
public final class ArchiveAnalysis {
    private static final int PROGRESS_PACKETS = 8192;

    private ArchiveAnalysis() {
    }

    /**
     * @param dictionary the dictionary to decode with when the archive holds none for a stream
     * @throws PointcallException when the archive cannot be read or holds no frame
     */
    public static SortieAnalysis.Reading analyse(ArchiveReader reader, ParameterDictionary dictionary, TestCard card,
                                                 Classifier classifier, ModelDescription model,
                                                 ReportProgress progress) {
        DictionaryRegistry registry = new DictionaryRegistry(List.of(dictionary));
        for (ArchiveReader.StoredDictionary d : reader.dictionaries()) {
            try {
                registry.register(DictionaryFiles.parse(d.text(), reader.file() + " (stored dictionary)"));
            } catch (PointcallException e) {
                // the stream announces its dictionary too; a stored copy that does not read is only counted below
            }
        }
        Sink sink = new Sink(card, classifier, model);
        PacketDecoder decoder = new PacketDecoder(registry, DictionaryFiles::parse, sink);
        long first = reader.firstTimeNs();
        long span = Math.max(1, reader.lastTimeNs() - first);
        long[] packets = new long[1];
        reader.read(r -> {
            if (r.isPacket()) {
                decoder.decode(r.body(), "archive", r.timeNs());
                if (++packets[0] % PROGRESS_PACKETS == 0) {
                    progress.progress(Math.min(0.99, (double) (r.timeNs() - first) / span),
                            "reading " + reader.file().getFileName() + ": " + packets[0] + " packets");
                }
            } else if (r.kind() == 3) {
                sink.typed(r);
            }
            return true;
        });
        decoder.flushPending();
        if (sink.session == null || sink.session.frames() == 0) {
            throw new PointcallException(reader.file() + ": no frame could be decoded from the archive");
        }
        sink.session.finish();
        sink.trace.finish();
        sink.timeline.finish();
        progress.progress(1, "read " + packets[0] + " packets");
        PointsFile points = sink.session.pointsFile(reader.file().getFileName().toString());
        return new SortieAnalysis.Reading(points, sink.trace, quality(reader, decoder, sink));
    }

    private static DataQuality quality(ArchiveReader reader, PacketDecoder decoder, Sink sink) {
        FrameTimeline t = sink.timeline;
        DecodeCounters c = decoder.counters();
        Map<String, Long> rejected = new LinkedHashMap<>();
        put(rejected, "packet CRC wrong", c.badCrc());
        put(rejected, "packet cut short", c.truncated());
        put(rejected, "packet length wrong", c.lengthMismatch());
        put(rejected, "not a pointcall packet", c.badMagic() + c.badVersion() + c.badHeader());
        put(rejected, "dictionary unknown", c.unknownDictionary());
        put(rejected, "slot count wrong", c.slotCountMismatch());
        put(rejected, "other streams (not reported)", sink.otherStreamFrames);
        SequenceTotals s = decoder.sequenceTotals();
        Map<String, Long> flagged = DataQuality.flagged(t);
        put(flagged, "frames lost on the link (sequence)", s.lost());
        List<String> problems = new ArrayList<>(reader.healthLines());
        if (sink.unreadableEvents > 0) {
            problems.add(sink.unreadableEvents + " typed records were not session events and were left aside");
        }
        return new DataQuality(reader.file().toString(), t.frames(), t.firstNs(), t.lastNs(), t.stepS(),
                t.gapCount(), t.missingS(), t.longestGapS(), t.gaps(), 0, rejected, Map.of(), Map.of(), flagged,
                List.of(), List.of(), reader.cutTail() == null,
                problems.subList(0, Math.min(problems.size(), DataQuality.PROBLEMS_SHOWN)));
    }

    private static void put(Map<String, Long> m, String k, long v) {
        if (v > 0) {
            m.put(k, v);
        }
    }

    /** The first stream's frames into a session made once its dictionary is known. */
    private static final class Sink implements StreamFrameSink {
        private final TestCard card;
        private final Classifier classifier;
        private final ModelDescription model;
        private final FrameTimeline timeline = new FrameTimeline();
        private CardSession session;
        private SortieTrace trace;
        private int streamId = -1;
        private long otherStreamFrames;
        private long unreadableEvents;

        Sink(TestCard card, Classifier classifier, ModelDescription model) {
            this.card = card;
            this.classifier = classifier;
            this.model = model;
        }

        @Override
        public void onDictionary(int stream, ParameterDictionary dictionary) {
            if (session == null) {
                streamId = stream;
                session = new CardSession(SessionSetup.of(dictionary, card, classifier, model,
                        CardAnalysers.standard()), e -> { });
                trace = new SortieTrace(dictionary, FigurePlan.traced(card, dictionary), SortieTrace.DEFAULT_STEP_S);
            }
        }

        @Override
        public void onFrame(int stream, Frame frame, long receiveTimeNs) {
            if (session == null) {
                return; // no dictionary yet: the decoder cannot have made a frame
            }
            if (stream != streamId) {
                otherStreamFrames++;
                return;
            }
            session.onFrame(frame);
            trace.onFrame(frame);
            timeline.onFrame(frame);
        }

        void typed(RecordView r) {
            SessionEvent e;
            try {
                e = PointsFiles.eventFromJson(new String(r.bodyBytes(), java.nio.charset.StandardCharsets.UTF_8));
            } catch (PointcallException | IllegalArgumentException ex) {
                if (!r.type().startsWith("recorder.")) {
                    unreadableEvents++;
                }
                return;
            }
            if (session == null || card == null) {
                return;
            }
            try {
                if (e instanceof SessionEvent.CallTaken c) {
                    session.call(c.call().cardId(), c.call().call(), c.call().note());
                } else if (e instanceof SessionEvent.PointArmed a) {
                    session.arm(a.cardId());
                }
            } catch (IllegalArgumentException ex) {
                unreadableEvents++; // a call on a point this card has not
            }
        }
    }
}
