package org.pointcall.ui.cli;

import java.io.PrintWriter;
import java.net.InetSocketAddress;
import java.nio.file.Path;
import java.util.Locale;
import java.util.concurrent.Callable;

import org.pointcall.ingest.udp.UdpSource;
import org.pointcall.ingest.udp.UdpSourceConfig;
import org.pointcall.ingest.wire.FaultLog;
import org.pointcall.replay.play.Destination;
import org.pointcall.replay.record.Recorder;
import org.pointcall.replay.record.RecorderPolicy;
import org.pointcall.replay.record.RecorderStats;
import org.pointcall.replay.record.SyncMode;

import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;

/** Records a live UDP stream, packet by packet as received, into a new sortie archive. */
@Command(name = "record",
        header = "Record a live UDP telemetry stream into a sortie archive.",
        mixinStandardHelpOptions = true,
        description = {
            "Listens on a UDP address and keeps every datagram exactly as it",
            "arrived, with its arrival time, in a new sortie archive in the given",
            "folder. Stops after --seconds, after --until-idle seconds without a",
            "packet, or on Ctrl-C. Recorder alarms (disk full, falling behind) go to",
            "standard error."
        })
public final class RecordCommand implements Callable<Integer> {
    @Option(names = "--listen", required = true, paramLabel = "udp://HOST:PORT", description = "where to listen")
    String listen;

    @Option(names = "--out", required = true, paramLabel = "DIR", description = "folder for the new archive")
    Path out;

    @Option(names = "--until-idle", paramLabel = "S", description = "stop after this many seconds without a packet")
    Double untilIdleS;

    @Option(names = "--seconds", paramLabel = "S", description = "stop after this many seconds")
    Double seconds;

    @Option(names = "--chunk-age", defaultValue = "200", paramLabel = "MS",
            description = "longest a chunk is held before it is written, ms (default: ${DEFAULT-VALUE})")
    long chunkAgeMs;

    @Option(names = "--sync", defaultValue = "each", paramLabel = "each|os",
            description = "force each chunk to the device, or leave it to the OS (default: ${DEFAULT-VALUE})")
    String sync;

    @Option(names = "--any-sender",
            description = "accept datagrams from any address (default: only the host listened on)")
    boolean anySender;

    @Spec
    CommandSpec spec;

    @Override
    public Integer call() throws InterruptedException {
        InetSocketAddress bind = Destination.parseUdp(listen);
        if (untilIdleS != null && !(untilIdleS > 0) || seconds != null && !(seconds > 0)) {
            throw new IllegalArgumentException("--until-idle and --seconds must be more than 0");
        }
        SyncMode mode = switch (sync.toLowerCase(Locale.ROOT)) {
            case "each" -> SyncMode.EACH_CHUNK;
            case "os" -> SyncMode.OS_DECIDES;
            default -> throw new IllegalArgumentException("--sync is each or os, got '" + sync + "'");
        };
        RecorderPolicy policy = RecorderPolicy.DEFAULT.withMaxChunkAgeNs(chunkAgeMs * 1_000_000L).withSync(mode);
        PrintWriter o = spec.commandLine().getOut();
        PrintWriter err = spec.commandLine().getErr();
        UdpSourceConfig cfg = new UdpSourceConfig(bind, UdpSourceConfig.DEFAULT_RECEIVE_BUFFER_BYTES,
                java.util.Set.of(), true);
        if (!anySender) {
            cfg = cfg.withAllowedSenders(java.util.Set.of(bind.getAddress().isAnyLocalAddress()
                    ? java.net.InetAddress.getLoopbackAddress() : bind.getAddress()));
        }
        Recorder rec = Recorder.startIn(out, policy, System::nanoTime, a -> {
            synchronized (err) {
                err.println("recorder alarm: " + a.message());
                err.flush();
            }
        });
        UdpSource rx;
        try {
            rx = new UdpSource(cfg, rec, new FaultLog(l -> {
                synchronized (err) {
                    err.println(l);
                    err.flush();
                }
            }, FaultLog.DEFAULT_MAX_LINES, FaultLog.DEFAULT_WINDOW_NS), System::nanoTime);
        } catch (RuntimeException e) {
            rec.close();
            throw e;
        }
        Thread hook = new Thread(() -> {
            rx.stop();
            rec.close();
        }, "record-shutdown");
        Runtime.getRuntime().addShutdownHook(hook);
        rx.start();
        o.println("recording " + listen + " (port " + rx.localPort() + ") into " + rec.file());
        o.flush();
        long start = System.nanoTime();
        long lastCount = 0;
        long lastChange = start;
        while (true) {
            Thread.sleep(50);
            long now = System.nanoTime();
            long n = rx.datagrams();
            if (n != lastCount) {
                lastCount = n;
                lastChange = now;
            }
            if (seconds != null && now - start >= seconds * 1e9) {
                break;
            }
            if (untilIdleS != null && now - lastChange >= untilIdleS * 1e9) {
                break;
            }
        }
        rx.stop();
        rec.close();
        try {
            Runtime.getRuntime().removeShutdownHook(hook);
        } catch (IllegalStateException ignored) {
            // shutting down already: the hook closes the recording again, harmlessly
        }
        RecorderStats s = rec.stats();
        o.println("archive: " + rec.file());
        o.println("datagrams: " + rx.datagrams() + " received, " + rx.rejectedSenders() + " from senders not allowed");
        o.println("packets: " + s.packetsWritten() + " recorded, " + s.notRecorded() + " not recorded");
        o.println("bytes: " + s.bytesWritten());
        o.flush();
        return 0;
    }
}
