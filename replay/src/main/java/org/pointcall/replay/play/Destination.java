package org.pointcall.replay.play;

import java.net.InetSocketAddress;
import java.util.Locale;

/**
 * Where a replay goes, as written on a command line: {@code udp://HOST:PORT} or {@code kafka://BOOTSTRAP/PREFIX}
 * (records go to the topic {@code PREFIX.frames}; a trailing {@code .frames} is accepted and dropped).
 *
 * @param udp       the UDP receiver, or null
 * @param bootstrap the Kafka bootstrap servers, or null
 * @param prefix    the Kafka topic prefix, or null
 */
public record Destination(InetSocketAddress udp, String bootstrap, String prefix) {
    public Destination {
        if ((udp == null) == (bootstrap == null)) {
            throw new IllegalArgumentException("a destination is either UDP or Kafka");
        }
    }

    public boolean isUdp() {
        return udp != null;
    }

    /** Parses {@code udp://HOST:PORT} or {@code kafka://BOOTSTRAP/PREFIX}; the message says what is wrong. */
    public static Destination parse(String text) {
        String t = text.trim();
        String lower = t.toLowerCase(Locale.ROOT);
        if (lower.startsWith("udp://")) {
            return new Destination(hostPort(t.substring(6), text), null, null);
        }
        if (lower.startsWith("kafka://")) {
            String rest = t.substring(8);
            int slash = rest.indexOf('/');
            if (slash <= 0 || slash == rest.length() - 1) {
                throw new IllegalArgumentException("'" + text + "': give kafka://BOOTSTRAP/PREFIX, for example "
                        + "kafka://127.0.0.1:9092/pointcall (records go to pointcall.frames)");
            }
            String prefix = rest.substring(slash + 1);
            if (prefix.endsWith(".frames")) {
                prefix = prefix.substring(0, prefix.length() - ".frames".length());
            }
            return new Destination(null, rest.substring(0, slash), prefix);
        }
        throw new IllegalArgumentException("'" + text + "': a destination is udp://HOST:PORT or "
                + "kafka://BOOTSTRAP/PREFIX");
    }

    /** HOST:PORT as a socket address (names resolved; port 1 to 65535). */
    public static InetSocketAddress hostPort(String hp, String whole) {
        int colon = hp.lastIndexOf(':');
        if (colon <= 0 || colon == hp.length() - 1) {
            throw new IllegalArgumentException("'" + whole + "': give HOST:PORT, for example 127.0.0.1:5700");
        }
        int port;
        try {
            port = Integer.parseInt(hp.substring(colon + 1));
        } catch (NumberFormatException e) {
            port = -1;
        }
        if (port < 1 || port > 65535) {
            throw new IllegalArgumentException("'" + whole + "': port must be 1 to 65535");
        }
        InetSocketAddress a = new InetSocketAddress(hp.substring(0, colon), port);
        if (a.isUnresolved()) {
            throw new IllegalArgumentException("'" + whole + "': unknown host " + hp.substring(0, colon));
        }
        return a;
    }

    /** Parses {@code udp://HOST:PORT} only (what a recorder listens on). */
    public static InetSocketAddress parseUdp(String text) {
        Destination d = parse(text);
        if (!d.isUdp()) {
            throw new IllegalArgumentException("'" + text + "': listen on udp://HOST:PORT");
        }
        return d.udp();
    }
}
