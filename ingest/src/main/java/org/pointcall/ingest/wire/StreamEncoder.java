package org.pointcall.ingest.wire;

import java.nio.ByteBuffer;
import java.nio.charset.StandardCharsets;
import java.util.concurrent.ThreadLocalRandom;

import org.pointcall.ingest.frame.Frame;
import org.pointcall.ingest.frame.FrameSink;
import org.pointcall.shared.dictionary.ParameterDictionary;

/**
 * Turns one stream's frames into packets: announces the dictionary first (and again every
 * {@link WireOptions#announceIntervalNs()} of frame time), batches whole frames while they fit, and splits a frame
 * too wide for one datagram into near-equal slot ranges, one packet each. Numbers packets per stream; announce and
 * frames packets share the sequence so a receiver sees a lost announce as a gap too.
 *
 * <p>Allocation-free per frame. Not thread-safe: one producer thread per stream.
 */
public final class StreamEncoder implements FrameSink {
    private final StreamIdentity id;
    private final WireOptions options;
    private final PacketSink out;
    private final PacketEncoder encoder;
    private final byte[] text;
    private final int textCrc;
    private final int slots;
    private final int flags;
    private final int framesPerPacket;
    private final int parts;
    private final int partSlots;

    private final long[] batchTimesNs;
    private final double[] batchValues;
    private int batched;
    private long batchFirstIndex;

    private long nextFrameIndex;
    private int nextSequence;
    private long packets;
    private long frames;
    private boolean announced;
    private long lastAnnounceTimeNs;

    /**
     * @param dictionaryText the dictionary as text for the announce (opaque here: the receiver's
     *                       {@link DictionaryDecoder} reads it)
     */
    public StreamEncoder(int streamId, int epoch, ParameterDictionary dictionary, String dictionaryText,
                         WireOptions options, PacketSink out) {
        this.slots = dictionary.size();
        this.id = new StreamIdentity(streamId, epoch, dictionary.hash(), slots);
        this.options = options;
        this.out = out;
        this.encoder = new PacketEncoder(options.maxDatagramBytes());
        this.text = dictionaryText.getBytes(StandardCharsets.UTF_8);
        encoder.announceFragments(text.length);
        this.textCrc = PacketEncoder.textCrc(text);
        this.flags = options.flags();
        int valueBytes = WireFormat.valueBytes(flags);
        int fit = WireFormat.framesPerPacket(options.maxDatagramBytes(), slots, valueBytes);
        if (fit >= 1) {
            int cap = options.maxFramesPerPacket();
            this.framesPerPacket = cap == 0 ? fit : Math.min(fit, cap);
            this.parts = 1;
            this.partSlots = slots;
        } else {
            int widest = WireFormat.maxSlotsPerPart(options.maxDatagramBytes(), valueBytes);
            this.framesPerPacket = 1;
            this.parts = (slots + widest - 1) / widest;
            this.partSlots = (slots + parts - 1) / parts;
        }
        this.batchTimesNs = new long[framesPerPacket];
        this.batchValues = new double[parts == 1 ? framesPerPacket * slots : 0];
    }

    /** A random session epoch: two sessions of one stream share it with probability 2^-32. */
    public static int newEpoch() {
        return ThreadLocalRandom.current().nextInt();
    }

    public StreamIdentity identity() {
        return id;
    }

    /** Packets one frame is split into (1 when whole frames fit a datagram). */
    public int partsPerFrame() {
        return parts;
    }

    /** Whole frames per packet (1 when frames are split into parts). */
    public int framesPerPacket() {
        return framesPerPacket;
    }

    /** Sequence number the next packet will carry. */
    public int nextSequence() {
        return nextSequence;
    }

    /** Sets the next packet's sequence number (a sender resuming a numbering, or a test of wrap-around). */
    public void nextSequence(int sequence) {
        this.nextSequence = sequence;
    }

    public long packets() {
        return packets;
    }

    public long frames() {
        return frames;
    }

    @Override
    public void onFrame(Frame frame) {
        if (frame.slots() != slots) {
            throw new IllegalArgumentException("frame has " + frame.slots() + " slots, the stream's dictionary "
                    + slots);
        }
        long t = frame.timeNs();
        if (!announced || (options.announceIntervalNs() > 0
                && (t - lastAnnounceTimeNs >= options.announceIntervalNs() || t < lastAnnounceTimeNs))) {
            flush();
            announce();
            lastAnnounceTimeNs = t;
        }
        frames++;
        if (parts > 1) {
            batchTimesNs[0] = t;
            for (int p = 0; p < parts; p++) {
                int first = p * partSlots;
                int n = Math.min(partSlots, slots - first);
                send(encoder.encodeFrames(id, flags, nextSequence, nextFrameIndex, batchTimesNs, frame.values(), 1,
                        first, n));
            }
            nextFrameIndex++;
            return;
        }
        if (batched > 0) {
            long offset = t - batchTimesNs[0];
            if (offset != (int) offset) {
                flush();
            }
        }
        if (batched == 0) {
            batchFirstIndex = nextFrameIndex;
        }
        batchTimesNs[batched] = t;
        System.arraycopy(frame.values(), 0, batchValues, batched * slots, slots);
        batched++;
        nextFrameIndex++;
        if (batched == framesPerPacket) {
            flush();
        }
    }

    /** Sends the frames batched so far, if any. Call when the producer pauses, so no frame waits indefinitely. */
    public void flush() {
        if (batched == 0) {
            return;
        }
        int n = batched;
        batched = 0;
        send(encoder.encodeFrames(id, flags, nextSequence, batchFirstIndex, batchTimesNs, batchValues, n, 0, slots));
    }

    /** Sends the dictionary announce now, in as many fragments as it needs. */
    public void announce() {
        int count = encoder.announceFragments(text.length);
        for (int i = 0; i < count; i++) {
            send(encoder.encodeAnnounce(id, flags & WireFormat.ANNOUNCE_FLAGS, nextSequence, text, textCrc, i));
        }
        announced = true;
    }

    private void send(ByteBuffer packet) {
        nextSequence++;
        packets++;
        out.onPacket(packet);
    }
}
