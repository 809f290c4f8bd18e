package org.pointcall.ingest.wire;

import java.nio.ByteBuffer;
import java.util.ArrayList;
import java.util.List;

import org.pointcall.ingest.frame.Frame;
import org.pointcall.shared.dictionary.ParameterDictionary;

/** Test sink keeping copies of every frame and dictionary change, and a packet sink keeping copies of packets. */
final class Collected implements StreamFrameSink {
    record Got(int streamId, Frame frame, long receiveTimeNs) {
    }

    final List<Got> frames = new ArrayList<>();
    final List<ParameterDictionary> dictionaries = new ArrayList<>();

    @Override
    public void onFrame(int streamId, Frame frame, long receiveTimeNs) {
        frames.add(new Got(streamId, frame.copy(), receiveTimeNs));
    }

    @Override
    public void onDictionary(int streamId, ParameterDictionary dictionary) {
        dictionaries.add(dictionary);
    }

    List<Frame> of(int streamId) {
        List<Frame> out = new ArrayList<>();
        for (Got g : frames) {
            if (g.streamId() == streamId) {
                out.add(g.frame());
            }
        }
        return out;
    }

    /** Packet sink that copies each packet into its own array. */
    static final class Packets implements PacketSink {
        final List<byte[]> list = new ArrayList<>();

        @Override
        public void onPacket(ByteBuffer packet) {
            byte[] b = new byte[packet.remaining()];
            packet.duplicate().get(b);
            list.add(b);
        }
    }
}
