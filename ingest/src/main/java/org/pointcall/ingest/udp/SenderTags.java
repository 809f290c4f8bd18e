package org.pointcall.ingest.udp;

import java.net.Inet4Address;
import java.net.InetAddress;
import java.net.InetSocketAddress;
import java.net.UnknownHostException;

/**
 * A packet's sender packed in a long, so queues carry no objects and archive packet records can store it: IPv4
 * address in bits 16 to 47, port in bits 0 to 15 (0 for no sender; the address part is 0 for another family).
 */
public final class SenderTags {
    private SenderTags() {
    }

    public static long pack(InetSocketAddress a) {
        if (a == null) {
            return 0L;
        }
        InetAddress ip = a.getAddress();
        long ip4 = 0;
        if (ip instanceof Inet4Address) {
            byte[] b = ip.getAddress();
            ip4 = ((b[0] & 0xffL) << 24) | ((b[1] & 0xffL) << 16) | ((b[2] & 0xffL) << 8) | (b[3] & 0xffL);
        }
        return (ip4 << 16) | (a.getPort() & 0xffff);
    }

    /** host:port, or "unknown sender" for 0. */
    public static String format(long tag) {
        if (tag == 0) {
            return "unknown sender";
        }
        long ip4 = tag >>> 16;
        byte[] b = {(byte) (ip4 >>> 24), (byte) (ip4 >>> 16), (byte) (ip4 >>> 8), (byte) ip4};
        try {
            return InetAddress.getByAddress(b).getHostAddress() + ":" + (tag & 0xffff);
        } catch (UnknownHostException e) {
            return "sender " + Long.toHexString(tag);
        }
    }
}
