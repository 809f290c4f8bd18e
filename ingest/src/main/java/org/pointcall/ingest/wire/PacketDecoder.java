package org.pointcall.ingest.wire;

import java.net.InetAddress;
import java.net.InetSocketAddress;
import java.nio.ByteBuffer;
import java.nio.CharBuffer;
import java.nio.charset.CharacterCodingException;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;
import java.util.Arrays;
import java.util.zip.CRC32C;

import org.pointcall.ingest.frame.Frame;
import org.pointcall.shared.dictionary.ParameterDictionary;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;

/**
 * Decodes datagrams of the wire format, whatever they hold: every datagram ends in exactly one
 * {@link DecodeResult}, counted in {@link #counters()}; a bad one is dropped with one rate-limited log line naming
 * sender, stream and sequence, and decoding goes on. Frames go to a {@link StreamFrameSink} through one reusable
 * {@link Frame} per stream; frames split into parts are put back together, and a frame some of whose parts were lost
 * is still delivered, with NaN in the lost slots and {@link Frame#PARTS_MISSING}. A frame after lost frames (a jump
 * in the frame index that a packet gap caused) or after a sender restart carries {@link Frame#GAP_BEFORE}; a gap
 * that lost only an announce or a part of a frame flags no frame as gapped, since no frame is missing.
 *
 * <p>Frames arriving before their dictionary is known are dropped and counted ({@link DecodeResult#UNKNOWN_DICTIONARY})
 * rather than buffered: without the dictionary their width and meaning are unknown, and senders re-announce every
 * second, so at most about a second of a stream is lost while fresh data keeps flowing.
 *
 * <p>Allocation-free for valid frames packets of known streams. Single-threaded: call {@link #decode} and
 * {@link #flushPending} from one thread; the counters and trackers may be read from any thread.
 */
public final class PacketDecoder {
    private static final Logger LOG = LoggerFactory.getLogger(PacketDecoder.class);

    private final DictionaryRegistry registry;
    private final DictionaryDecoder parser;
    private final StreamFrameSink sink;
    private final DecoderOptions options;
    private final FaultLog log;
    private final DecodeCounters counters = new DecodeCounters();
    private final CRC32C crc = new CRC32C();
    private volatile StreamState[] streams = new StreamState[0];
    private StreamState last;

    public PacketDecoder(DictionaryRegistry registry, DictionaryDecoder parser, StreamFrameSink sink) {
        this(registry, parser, sink, DecoderOptions.DEFAULT, FaultLog.toLogger(LOG));
    }

    public PacketDecoder(DictionaryRegistry registry, DictionaryDecoder parser, StreamFrameSink sink,
                         DecoderOptions options, FaultLog log) {
        this.registry = registry;
        this.parser = parser;
        this.sink = sink;
        this.options = options;
        this.log = log;
    }

    public DecodeCounters counters() {
        return counters;
    }

    public DecoderOptions options() {
        return options;
    }

    public FaultLog log() {
        return log;
    }

    /** Sequence tracking of a stream, or null if no valid packet of it arrived yet. */
    public StreamTracker tracker(int streamId) {
        for (StreamState s : streams) {
            if (s.streamId == streamId) {
                return s.tracker;
            }
        }
        return null;
    }

    /** Dictionary the stream's frames currently follow, or null. */
    public ParameterDictionary dictionary(int streamId) {
        for (StreamState s : streams) {
            if (s.streamId == streamId) {
                return s.dictionary;
            }
        }
        return null;
    }

    /** Stream ids seen, in order of first arrival. */
    public int[] streamIds() {
        StreamState[] ss = streams;
        int[] ids = new int[ss.length];
        for (int i = 0; i < ss.length; i++) {
            ids[i] = ss[i].streamId;
        }
        return ids;
    }

    public SequenceTotals sequenceTotals() {
        long received = 0;
        long lost = 0;
        long gaps = 0;
        long late = 0;
        long dups = 0;
        long stale = 0;
        long restarts = 0;
        long resyncs = 0;
        for (StreamState s : streams) {
            StreamTracker t = s.tracker;
            received += t.received();
            lost += t.lost();
            gaps += t.gapEvents();
            late += t.late();
            dups += t.duplicates();
            stale += t.stale();
            restarts += t.restarts();
            resyncs += t.resyncs();
        }
        return new SequenceTotals(received, lost, gaps, late, dups, stale, restarts, resyncs);
    }

    /**
     * Decodes the datagram between the buffer's position and limit. Sets the buffer's byte order to little-endian;
     * leaves position and limit as they were. Never throws for any content; an exception from the sink passes
     * through.
     *
     * @param origin        where the datagram came from, for log lines only (an InetSocketAddress shows as
     *                      host:port); not formatted unless a line is written
     * @param receiveTimeNs receiver clock at arrival, handed to the sink and used as the log's clock
     */
    public DecodeResult decode(ByteBuffer packet, Object origin, long receiveTimeNs) {
        packet.order(WireFormat.ORDER);
        DecodeResult r = check(packet, origin, receiveTimeNs);
        counters.count(r);
        return r;
    }

    /** Delivers every frame still waiting for parts, as partial. Call when the source stops. */
    public void flushPending() {
        for (StreamState s : streams) {
            flushPartial(s);
        }
    }

    private DecodeResult check(ByteBuffer p, Object origin, long now) {
        int base = p.position();
        int len = p.remaining();
        if (len > options.maxDatagramBytes()) {
            if (log.admit(now)) {
                log.emit("packet from " + origin(origin) + " (" + len + " bytes): larger than the "
                        + options.maxDatagramBytes() + "-byte limit, dropped");
            }
            return DecodeResult.OVERSIZE;
        }
        if (len < WireFormat.MIN_PACKET_BYTES) {
            if (log.admit(now)) {
                log.emit("packet from " + origin(origin) + " (" + len + " bytes): truncated, shorter than the "
                        + WireFormat.MIN_PACKET_BYTES + "-byte minimum of header and trailer");
            }
            return DecodeResult.TRUNCATED;
        }
        int magic = p.getInt(base + WireFormat.OFF_MAGIC);
        if (magic != WireFormat.MAGIC) {
            if (log.admit(now)) {
                log.emit("packet from " + origin(origin) + " (" + len + " bytes): bad magic " + hex(magic)
                        + ", expected " + hex(WireFormat.MAGIC) + " ('PCLW'): not a pointcall packet");
            }
            return DecodeResult.BAD_MAGIC;
        }
        int streamId = p.getInt(base + WireFormat.OFF_STREAM);
        int seq = p.getInt(base + WireFormat.OFF_SEQUENCE);
        int version = p.get(base + WireFormat.OFF_VERSION) & 0xff;
        if (version != WireFormat.VERSION) {
            if (log.admit(now)) {
                log.emit(where(origin, streamId, seq) + ": format version " + version
                        + " is not read by this build (it reads version " + WireFormat.VERSION + ")");
            }
            return DecodeResult.BAD_VERSION;
        }
        int declared = p.getInt(base + WireFormat.OFF_LENGTH);
        if (declared < 0 || declared > len) {
            if (log.admit(now)) {
                log.emit(where(origin, streamId, seq) + ": truncated, " + len + " of "
                        + Integer.toUnsignedString(declared) + " declared bytes arrived");
            }
            return DecodeResult.TRUNCATED;
        }
        if (declared < len) {
            if (log.admit(now)) {
                log.emit(where(origin, streamId, seq) + ": " + (len - declared)
                        + " bytes beyond its declared length of " + declared);
            }
            return DecodeResult.LENGTH_MISMATCH;
        }
        int carried = p.getInt(base + len - WireFormat.TRAILER_BYTES);
        int limit = p.limit();
        p.limit(base + len - WireFormat.TRAILER_BYTES);
        crc.reset();
        crc.update(p);
        p.limit(limit).position(base);
        int computed = (int) crc.getValue();
        if (computed != carried) {
            if (log.admit(now)) {
                log.emit(where(origin, streamId, seq) + ": CRC mismatch (computed " + hex(computed) + ", carried "
                        + hex(carried) + ")");
            }
            return DecodeResult.BAD_CRC;
        }
        int type = p.get(base + WireFormat.OFF_TYPE) & 0xff;
        if (type == WireFormat.TYPE_FRAMES) {
            return frames(p, base, len, origin, now, streamId, seq);
        }
        if (type == WireFormat.TYPE_ANNOUNCE) {
            return announce(p, base, len, origin, now, streamId, seq);
        }
        return header(origin, now, streamId, seq, "unknown packet type " + type);
    }

    private DecodeResult frames(ByteBuffer p, int base, int len, Object origin, long now, int streamId, int seq) {
        if (len < WireFormat.FRAMES_HEADER_BYTES + WireFormat.TRAILER_BYTES) {
            if (log.admit(now)) {
                log.emit(where(origin, streamId, seq) + ": truncated, " + len + " bytes is shorter than a frames "
                        + "packet's header and trailer (" + (WireFormat.FRAMES_HEADER_BYTES
                        + WireFormat.TRAILER_BYTES) + ")");
            }
            return DecodeResult.TRUNCATED;
        }
        int flags = u16(p, base + WireFormat.OFF_FLAGS);
        if ((flags & ~WireFormat.FRAMES_FLAGS) != 0) {
            return header(origin, now, streamId, seq, "unknown flags " + hex(flags));
        }
        int dictSlots = u16(p, base + WireFormat.OFF_DICT_SLOTS);
        int frameCount = u16(p, base + WireFormat.OFF_FRAME_COUNT);
        int firstSlot = u16(p, base + WireFormat.OFF_FIRST_SLOT);
        int partSlots = u16(p, base + WireFormat.OFF_PART_SLOTS);
        if (frameCount == 0 || partSlots == 0 || dictSlots == 0) {
            return header(origin, now, streamId, seq, "zero in frame count (" + frameCount + "), part slots ("
                    + partSlots + ") or dictionary slots (" + dictSlots + ")");
        }
        if (firstSlot + partSlots > dictSlots) {
            return header(origin, now, streamId, seq, "slots [" + firstSlot + ", " + (firstSlot + partSlots)
                    + ") lie beyond the " + dictSlots + " slots of its dictionary");
        }
        if (partSlots < dictSlots && frameCount != 1) {
            return header(origin, now, streamId, seq, "carries part of a frame but " + frameCount
                    + " frames (a part packet carries one)");
        }
        int valueBytes = WireFormat.valueBytes(flags);
        long expected = WireFormat.framesPacketBytes(frameCount, partSlots, valueBytes);
        if (expected != len) {
            if (log.admit(now)) {
                log.emit(where(origin, streamId, seq) + ": " + frameCount + " frames of " + partSlots + " "
                        + (valueBytes == 4 ? "float32" : "float64") + " values need " + expected
                        + " bytes, the packet has " + len);
            }
            return DecodeResult.LENGTH_MISMATCH;
        }
        StreamState s = stream(streamId);
        if (s == null) {
            return streamLimit(origin, now, streamId, seq);
        }
        // the tracker sees every packet that reached its stream, so loss accounting counts it as arrived even
        // when its content is refused below; content faults do not depend on sequence state
        SequenceVerdict v = s.tracker.observe(p.getInt(base + WireFormat.OFF_EPOCH), seq);
        applyVerdict(s, v);
        long hash = p.getLong(base + WireFormat.OFF_DICT_HASH);
        ParameterDictionary d = s.bound && s.hash == hash ? s.dictionary : registry.find(hash);
        if (d == null) {
            if (log.admit(now)) {
                log.emit(where(origin, streamId, seq) + ": no dictionary with hash " + hex(hash)
                        + " registered or announced yet; frames dropped until its announce arrives");
            }
            return DecodeResult.UNKNOWN_DICTIONARY;
        }
        if (d.size() != dictSlots) {
            return slotMismatch(origin, now, streamId, seq, dictSlots, d);
        }
        if (!logVerdict(s, v, origin, now, seq)) {
            return v == SequenceVerdict.DUPLICATE ? DecodeResult.DUPLICATE : DecodeResult.STALE;
        }
        if (!s.bound || s.hash != hash) {
            flushPartial(s);
            if (s.bound) {
                // a new slot layout starts a new series of frames, whatever their indices say
                s.resetContinuity();
            }
            s.bind(d);
            sink.onDictionary(streamId, d);
        }

        boolean whole = partSlots == dictSlots;
        boolean float32 = valueBytes == 4;
        int synthetic = (flags & WireFormat.FLAG_SYNTHETIC) != 0 ? Frame.SYNTHETIC : 0;
        long firstIndex = p.getLong(base + WireFormat.OFF_FIRST_INDEX);
        long t0 = p.getLong(base + WireFormat.OFF_FIRST_TIME);
        int offsetsAt = base + WireFormat.FRAMES_HEADER_BYTES;
        int valuesAt = offsetsAt + 4 * (frameCount - 1);
        int rowBytes = partSlots * valueBytes;
        for (int i = 0; i < frameCount; i++) {
            long index = firstIndex + i;
            long t = i == 0 ? t0 : t0 + p.getInt(offsetsAt + 4 * (i - 1));
            int at = valuesAt + i * rowBytes;
            if (whole) {
                if (s.hasPending && s.pendingIndex <= index) {
                    flushPartial(s);
                }
                if (s.hasDelivered && index <= s.lastIndex) {
                    counters.frameLate();
                    continue;
                }
                read(p, at, s.out.values(), 0, partSlots, float32);
                deliver(s, s.out, index, t, synthetic, now, false);
                continue;
            }
            if (s.hasPending && s.pendingIndex < index) {
                flushPartial(s);
            }
            if (s.hasDelivered && index <= s.lastIndex) {
                counters.frameLate();
                continue;
            }
            if (s.hasPending && s.pendingIndex > index) {
                // a part of an older frame than the one being put together: deliver what there is of it now,
                // so frames still leave in order
                s.out.clear();
                read(p, at, s.out.values(), firstSlot, partSlots, float32);
                logPartial(s, index, partSlots, now);
                deliver(s, s.out, index, t, synthetic, now, true);
                continue;
            }
            if (!s.hasPending) {
                s.startPending(index, t, synthetic);
            }
            merge(p, at, s, firstSlot, partSlots, float32);
            s.pendingReceiveNs = now;
            if (s.pendingCovered == s.slots) {
                s.hasPending = false;
                deliver(s, s.pending, s.pendingIndex, s.pendingTimeNs, s.pendingFlags, now, false);
            }
        }
        return DecodeResult.FRAMES;
    }

    private DecodeResult announce(ByteBuffer p, int base, int len, Object origin, long now, int streamId,
                                  int seq) {
        int min = WireFormat.ANNOUNCE_HEADER_BYTES + 1 + WireFormat.TRAILER_BYTES;
        if (len < min) {
            if (log.admit(now)) {
                log.emit(where(origin, streamId, seq) + ": truncated, " + len + " bytes is shorter than an "
                        + "announce's header, one byte of text and trailer (" + min + ")");
            }
            return DecodeResult.TRUNCATED;
        }
        int flags = u16(p, base + WireFormat.OFF_FLAGS);
        if ((flags & ~WireFormat.ANNOUNCE_FLAGS) != 0) {
            return header(origin, now, streamId, seq, "unknown announce flags " + hex(flags));
        }
        int dictSlots = u16(p, base + WireFormat.OFF_DICT_SLOTS);
        int index = u16(p, base + WireFormat.OFF_FRAGMENT_INDEX);
        int count = u16(p, base + WireFormat.OFF_FRAGMENT_COUNT);
        int reserved = u16(p, base + WireFormat.OFF_RESERVED);
        long textLength = Integer.toUnsignedLong(p.getInt(base + WireFormat.OFF_TEXT_LENGTH));
        long offset = Integer.toUnsignedLong(p.getInt(base + WireFormat.OFF_FRAGMENT_OFFSET));
        int textCrc = p.getInt(base + WireFormat.OFF_TEXT_CRC);
        int fragmentBytes = len - WireFormat.ANNOUNCE_HEADER_BYTES - WireFormat.TRAILER_BYTES;
        if (reserved != 0 || dictSlots == 0 || count == 0 || index >= count) {
            return header(origin, now, streamId, seq, "announce fragment " + index + " of " + count
                    + ", dictionary slots " + dictSlots + ", reserved " + reserved + ": out of range");
        }
        if (offset + fragmentBytes > textLength || count > textLength) {
            return header(origin, now, streamId, seq, "announce fragment of " + fragmentBytes + " bytes at "
                    + offset + " does not fit a text of " + textLength + " bytes in " + count + " fragments");
        }
        if (textLength > options.maxAnnounceTextBytes()) {
            if (log.admit(now)) {
                log.emit(where(origin, streamId, seq) + ": announces " + textLength
                        + " bytes of dictionary text, more than the limit of " + options.maxAnnounceTextBytes());
            }
            return DecodeResult.OVERSIZE;
        }
        StreamState s = stream(streamId);
        if (s == null) {
            return streamLimit(origin, now, streamId, seq);
        }
        SequenceVerdict v = s.tracker.observe(p.getInt(base + WireFormat.OFF_EPOCH), seq);
        applyVerdict(s, v);
        long hash = p.getLong(base + WireFormat.OFF_DICT_HASH);
        ParameterDictionary known = s.bound && s.hash == hash ? s.dictionary : registry.find(hash);
        if (known != null && known.size() != dictSlots) {
            return slotMismatch(origin, now, streamId, seq, dictSlots, known);
        }
        if (!logVerdict(s, v, origin, now, seq)) {
            return v == SequenceVerdict.DUPLICATE ? DecodeResult.DUPLICATE : DecodeResult.STALE;
        }
        if (known != null) {
            return DecodeResult.ANNOUNCE;
        }
        AnnounceAssembly a = s.assembly;
        if (a == null || !a.matches(hash, (int) textLength, textCrc, count, dictSlots)) {
            if (a != null) {
                counters.announceAbandoned();
            }
            a = new AnnounceAssembly(hash, (int) textLength, textCrc, count, dictSlots);
            s.assembly = a;
        }
        if (!a.add(index, p, base + WireFormat.ANNOUNCE_HEADER_BYTES, fragmentBytes, (int) offset)) {
            return DecodeResult.ANNOUNCE;
        }
        s.assembly = null;
        return learn(a, origin, now, streamId, seq);
    }

    private DecodeResult learn(AnnounceAssembly a, Object origin, long now, int streamId, int seq) {
        String problem = null;
        ParameterDictionary d = null;
        if (a.bytesGot != a.textLength) {
            problem = "its fragments hold " + a.bytesGot + " bytes of text, the announce declares " + a.textLength;
        } else {
            CRC32C c = new CRC32C();
            c.update(a.bytes(), 0, a.textLength);
            if ((int) c.getValue() != a.textCrc) {
                problem = "text CRC mismatch (computed " + hex((int) c.getValue()) + ", carried " + hex(a.textCrc)
                        + ")";
            } else {
                String text = null;
                try {
                    CharBuffer chars = StandardCharsets.UTF_8.newDecoder()
                            .onMalformedInput(CodingErrorAction.REPORT)
                            .onUnmappableCharacter(CodingErrorAction.REPORT)
                            .decode(ByteBuffer.wrap(a.bytes(), 0, a.textLength));
                    text = chars.toString();
                } catch (CharacterCodingException e) {
                    problem = "dictionary text is not valid UTF-8";
                }
                if (text != null) {
                    String source = "announce from " + origin(origin) + " stream " + streamId;
                    try {
                        d = parser.decode(text, source);
                        if (d == null) {
                            problem = "dictionary reader returned nothing";
                        } else if (d.hash() != a.hash) {
                            problem = "dictionary text gives hash " + hex(d.hash()) + ", the announce declares "
                                    + hex(a.hash);
                        } else if (d.size() != a.dictionarySlots) {
                            return slotMismatch(origin, now, streamId, seq, a.dictionarySlots, d);
                        }
                    } catch (RuntimeException e) {
                        problem = "dictionary text rejected: " + oneLine(e.getMessage());
                    }
                }
            }
        }
        if (problem != null) {
            if (log.admit(now)) {
                log.emit(where(origin, streamId, seq) + ": announce of dictionary " + hex(a.hash) + " refused: "
                        + problem);
            }
            return DecodeResult.BAD_ANNOUNCE;
        }
        registry.register(d);
        counters.dictionaryLearnt();
        LOG.info("stream {} from {}: dictionary '{}' ({} parameters, hash {}) learnt from its announce", streamId,
                origin(origin), d.name(), d.size(), hex(d.hash()));
        return DecodeResult.ANNOUNCE;
    }

    /**
     * What a verdict changes in the stream's state, whatever becomes of the packet. A packet gap needs nothing here:
     * lost frames show as a jump in frame index and lost parts as a partial frame, both flagged at delivery.
     */
    private void applyVerdict(StreamState s, SequenceVerdict v) {
        if (v == SequenceVerdict.RESTART || v == SequenceVerdict.RESYNC) {
            flushPartial(s);
            s.resetContinuity();
        }
    }

    /** Logs a verdict that is a problem; false when the packet is to be dropped. */
    private boolean logVerdict(StreamState s, SequenceVerdict v, Object origin, long now, int seq) {
        switch (v) {
            case FIRST:
            case IN_ORDER:
                return true;
            case AFTER_GAP:
                if (log.admit(now)) {
                    int gap = s.tracker.lastGap();
                    log.emit(where(origin, s.streamId, seq) + ": " + gap + (gap == 1 ? " packet" : " packets")
                            + " missing before it");
                }
                return true;
            case LATE:
                if (log.admit(now)) {
                    log.emit(where(origin, s.streamId, seq) + ": arrived late, "
                            + ((int) s.tracker.highestSequence() - seq) + " behind the newest; fills its gap");
                }
                return true;
            case DUPLICATE:
                if (log.admit(now)) {
                    log.emit(where(origin, s.streamId, seq) + ": duplicate, dropped");
                }
                return false;
            case STALE:
                if (log.admit(now)) {
                    log.emit(where(origin, s.streamId, seq) + ": far behind the newest (seq "
                            + s.tracker.highestSequence() + ") or older than the first packet tracked, dropped");
                }
                return false;
            case RESTART:
                if (log.admit(now)) {
                    log.emit(where(origin, s.streamId, seq) + ": sender restarted (epoch "
                            + hex(s.tracker.epoch()) + " replaces " + hex(s.tracker.previousEpoch())
                            + "), sequence tracking starts again");
                }
                return true;
            case RESYNC:
                if (log.admit(now)) {
                    log.emit(where(origin, s.streamId, seq) + ": " + options.resyncAfter()
                            + " packets in a row far behind the newest: taken as a sender restart without a new "
                            + "epoch, sequence tracking starts again");
                }
                return true;
            default:
                throw new IllegalStateException("unhandled verdict " + v);
        }
    }

    private void deliver(StreamState s, Frame f, long index, long timeNs, int flags, long receiveNs,
                         boolean partial) {
        int fl = flags;
        if (s.gapPending || (s.hasDelivered && index != s.lastIndex + 1)) {
            fl |= Frame.GAP_BEFORE;
        }
        if (s.hasDelivered && timeNs <= s.lastTimeNs) {
            fl |= Frame.TIME_SUSPECT;
        }
        if (partial) {
            fl |= Frame.PARTS_MISSING;
        }
        s.gapPending = false;
        s.hasDelivered = true;
        s.lastIndex = index;
        s.lastTimeNs = timeNs;
        f.flags(fl);
        f.sequence(index);
        f.timeNs(timeNs);
        counters.frameDelivered(partial);
        sink.onFrame(s.streamId, f, receiveNs);
    }

    private void flushPartial(StreamState s) {
        if (!s.hasPending) {
            return;
        }
        s.hasPending = false;
        logPartial(s, s.pendingIndex, s.pendingCovered, s.pendingReceiveNs);
        deliver(s, s.pending, s.pendingIndex, s.pendingTimeNs, s.pendingFlags, s.pendingReceiveNs, true);
    }

    private void logPartial(StreamState s, long index, int covered, long now) {
        if (log.admit(now)) {
            log.emit("stream " + s.streamId + " frame " + index + ": only " + covered + " of " + s.slots
                    + " slots arrived (parts lost); delivered with the rest NaN");
        }
    }

    private static void read(ByteBuffer p, int at, double[] dst, int from, int n, boolean float32) {
        if (float32) {
            for (int k = 0; k < n; k++) {
                dst[from + k] = p.getFloat(at + 4 * k);
            }
        } else {
            for (int k = 0; k < n; k++) {
                dst[from + k] = p.getDouble(at + 8 * k);
            }
        }
    }

    private static void merge(ByteBuffer p, int at, StreamState s, int firstSlot, int n, boolean float32) {
        long[] bits = s.pendingSlots;
        double[] dst = s.pending.values();
        int step = float32 ? 4 : 8;
        for (int k = 0; k < n; k++) {
            int slot = firstSlot + k;
            long m = 1L << (slot & 63);
            if ((bits[slot >>> 6] & m) != 0) {
                continue;
            }
            bits[slot >>> 6] |= m;
            s.pendingCovered++;
            dst[slot] = float32 ? p.getFloat(at + step * k) : p.getDouble(at + step * k);
        }
    }

    private StreamState stream(int streamId) {
        StreamState l = last;
        if (l != null && l.streamId == streamId) {
            return l;
        }
        StreamState[] ss = streams;
        for (StreamState s : ss) {
            if (s.streamId == streamId) {
                last = s;
                return s;
            }
        }
        if (ss.length >= options.maxStreams()) {
            return null;
        }
        StreamState s = new StreamState(streamId, new StreamTracker(options.reorderWindow(), options.resyncAfter()));
        StreamState[] grown = Arrays.copyOf(ss, ss.length + 1);
        grown[ss.length] = s;
        streams = grown;
        last = s;
        return s;
    }

    private DecodeResult header(Object origin, long now, int streamId, int seq, String what) {
        if (log.admit(now)) {
            log.emit(where(origin, streamId, seq) + ": bad header, " + what);
        }
        return DecodeResult.BAD_HEADER;
    }

    private DecodeResult streamLimit(Object origin, long now, int streamId, int seq) {
        if (log.admit(now)) {
            log.emit(where(origin, streamId, seq) + ": a new stream beyond the limit of " + options.maxStreams()
                    + " streams, dropped");
        }
        return DecodeResult.STREAM_LIMIT;
    }

    private DecodeResult slotMismatch(Object origin, long now, int streamId, int seq, int headerSlots,
                                      ParameterDictionary d) {
        if (log.admit(now)) {
            log.emit(where(origin, streamId, seq) + ": header says " + headerSlots + " slots, dictionary '"
                    + d.name() + "' (hash " + hex(d.hash()) + ") has " + d.size());
        }
        return DecodeResult.SLOT_COUNT_MISMATCH;
    }

    private static int u16(ByteBuffer p, int at) {
        return p.getShort(at) & 0xffff;
    }

    private static String where(Object origin, int streamId, int seq) {
        return "packet from " + origin(origin) + " stream " + streamId + " seq " + Integer.toUnsignedString(seq);
    }

    /** host:port for a socket address (no leading slash, no name lookup), else the object's text. */
    static String origin(Object o) {
        if (o instanceof InetSocketAddress a) {
            InetAddress ad = a.getAddress();
            return (ad != null ? ad.getHostAddress() : a.getHostString()) + ":" + a.getPort();
        }
        return String.valueOf(o);
    }

    private static String hex(int v) {
        return String.format("0x%08x", v);
    }

    private static String hex(long v) {
        return String.format("0x%016x", v);
    }

    private static String oneLine(String s) {
        if (s == null) {
            return "(no reason given)";
        }
        return s.replace("\r", "").replace('\n', ';');
    }
}
