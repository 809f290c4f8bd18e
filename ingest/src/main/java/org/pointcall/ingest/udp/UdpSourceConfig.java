package org.pointcall.ingest.udp;

import java.net.InetAddress;
import java.net.InetSocketAddress;
import java.util.Objects;
import java.util.Set;

/**
 * Where and from whom a {@link UdpSource} receives.
 *
 * @param bind               local address and port; port 0 picks a free one (see {@link UdpSource#localPort()})
 * @param receiveBufferBytes SO_RCVBUF asked of the OS, 0 to keep its default; the OS may cap it (Linux: at
 *                           net.core.rmem_max), see {@link UdpSource#receiveBufferBytes()} for what was granted
 * @param allowedSenders     sender addresses accepted; datagrams from others are counted and dropped
 * @param anySender          accept every sender (then {@code allowedSenders} must be empty)
 */
public record UdpSourceConfig(InetSocketAddress bind, int receiveBufferBytes, Set<InetAddress> allowedSenders,
                              boolean anySender) {
    /** Asked for by default: 4 MiB, at most about 200 ms of a 20,000 packet/s stream of 1 KB datagrams. */
    public static final int DEFAULT_RECEIVE_BUFFER_BYTES = 4 << 20;

    public UdpSourceConfig {
        Objects.requireNonNull(bind, "bind");
        allowedSenders = Set.copyOf(allowedSenders);
        if (receiveBufferBytes < 0) {
            throw new IllegalArgumentException("receive buffer must be >= 0 bytes (0 = OS default), got "
                    + receiveBufferBytes);
        }
        if (anySender == !allowedSenders.isEmpty()) {
            throw new IllegalArgumentException(anySender
                    ? "either accept any sender or list allowed senders, not both"
                    : "name at least one allowed sender, or accept any sender explicitly");
        }
    }

    /** Bound to 127.0.0.1 on {@code port}, accepting only 127.0.0.1. */
    public static UdpSourceConfig loopback(int port) {
        InetAddress lo = InetAddress.getLoopbackAddress();
        return new UdpSourceConfig(new InetSocketAddress(lo, port), DEFAULT_RECEIVE_BUFFER_BYTES, Set.of(lo), false);
    }

    public UdpSourceConfig withReceiveBufferBytes(int bytes) {
        return new UdpSourceConfig(bind, bytes, allowedSenders, anySender);
    }

    public UdpSourceConfig withAllowedSenders(Set<InetAddress> senders) {
        return new UdpSourceConfig(bind, receiveBufferBytes, senders, false);
    }

    public UdpSourceConfig withAnySender() {
        return new UdpSourceConfig(bind, receiveBufferBytes, Set.of(), true);
    }
}
