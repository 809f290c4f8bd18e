package org.pointcall.ingest.udp;

import java.net.InetSocketAddress;
import java.nio.ByteBuffer;

import org.pointcall.ingest.wire.PacketDecoder;

/**
 * What a {@link UdpSource} does with each accepted datagram, on its receive thread: decode it there (the simple
 * one-thread case) or hand it to a pipeline thread through a bounded queue.
 */
public interface DatagramHandler {
    /** The buffer is only valid during the call. */
    void onDatagram(ByteBuffer datagram, InetSocketAddress sender, long receiveTimeNs);

    /** Called once when receiving stops, on the receive thread. */
    default void onStop() {
    }

    /** Decodes on the receive thread. */
    static DatagramHandler decoding(PacketDecoder decoder) {
        return new DatagramHandler() {
            @Override
            public void onDatagram(ByteBuffer datagram, InetSocketAddress sender, long receiveTimeNs) {
                decoder.decode(datagram, sender, receiveTimeNs);
            }

            @Override
            public void onStop() {
                decoder.flushPending();
            }
        };
    }
}
