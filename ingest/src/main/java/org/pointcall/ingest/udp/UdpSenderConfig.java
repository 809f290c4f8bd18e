package org.pointcall.ingest.udp;

import java.net.InetAddress;
import java.net.InetSocketAddress;
import java.util.Objects;

/**
 * Where a {@link UdpSender} sends and how fast.
 *
 * @param target          receiver address and port
 * @param bind            local address to send from (port 0: any free port)
 * @param sendBufferBytes SO_SNDBUF asked of the OS, 0 to keep its default
 * @param packetsPerSecond pacing of every packet sent, 0 for as fast as the socket takes them
 */
public record UdpSenderConfig(InetSocketAddress target, InetSocketAddress bind, int sendBufferBytes,
                              double packetsPerSecond) {
    public UdpSenderConfig {
        Objects.requireNonNull(target, "target");
        Objects.requireNonNull(bind, "bind");
        if (sendBufferBytes < 0) {
            throw new IllegalArgumentException("send buffer must be >= 0 bytes (0 = OS default), got "
                    + sendBufferBytes);
        }
        if (!(packetsPerSecond >= 0) || Double.isInfinite(packetsPerSecond)) {
            throw new IllegalArgumentException("packets per second must be >= 0 (0 = unpaced), got "
                    + packetsPerSecond);
        }
    }

    /** From 127.0.0.1 (any port) to 127.0.0.1:{@code port}, unpaced. */
    public static UdpSenderConfig loopback(int port) {
        InetAddress lo = InetAddress.getLoopbackAddress();
        return new UdpSenderConfig(new InetSocketAddress(lo, port), new InetSocketAddress(lo, 0), 0, 0);
    }

    /** To {@code target}, from any free port (on loopback when the target is), unpaced. */
    public static UdpSenderConfig to(InetSocketAddress target) {
        InetAddress from = target.getAddress() != null && target.getAddress().isLoopbackAddress()
                ? InetAddress.getLoopbackAddress() : null;
        return new UdpSenderConfig(target, from == null ? new InetSocketAddress(0) : new InetSocketAddress(from, 0),
                0, 0);
    }

    public UdpSenderConfig withPacketsPerSecond(double pps) {
        return new UdpSenderConfig(target, bind, sendBufferBytes, pps);
    }

    public UdpSenderConfig withSendBufferBytes(int bytes) {
        return new UdpSenderConfig(target, bind, bytes, packetsPerSecond);
    }
}
