package org.pointcall.ui.cli;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.Callable;

import org.pointcall.ingest.file.ReadOptions;
import org.pointcall.ingest.kafka.KafkaFrameSink;
import org.pointcall.ingest.kafka.KafkaSettings;
import org.pointcall.ingest.udp.UdpSender;
import org.pointcall.ingest.udp.UdpSenderConfig;
import org.pointcall.ingest.wire.WireOptions;
import org.pointcall.replay.archive.ArchiveFormat;
import org.pointcall.replay.archive.ArchiveReader;
import org.pointcall.replay.play.ArchiveSource;
import org.pointcall.replay.play.Destination;
import org.pointcall.replay.play.FileSource;
import org.pointcall.replay.play.ReplayClock;
import org.pointcall.replay.play.ReplayControl;
import org.pointcall.replay.play.ReplaySource;
import org.pointcall.replay.play.ReplaySummary;
import org.pointcall.replay.play.ReplayTarget;
import org.pointcall.replay.play.ReplayTargets;
import org.pointcall.replay.play.Replayer;
import org.pointcall.shared.demo.DemoFiles;
import org.pointcall.shared.dictionary.DictionaryFiles;
import org.pointcall.shared.dictionary.ParameterDictionary;

import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;

/** Re-streams a sortie archive or a recorded file over UDP or to Kafka, at a chosen speed. */
@Command(name = "replay",
        header = "Re-stream a sortie archive or a CSV/XLSX file over UDP or to Kafka.",
        mixinStandardHelpOptions = true,
        description = {
            "Plays a sortie archive (" + ArchiveFormat.EXTENSION + ") packet by packet exactly as it was",
            "received, on its arrival times, or a CSV/XLSX file as a wire stream on",
            "its frame times, at 0.1 to 100 times real time or as fast as the",
            "destination takes it."
        })
public final class ReplayCommand implements Callable<Integer> {
    @Option(names = "--input", required = true, paramLabel = "FILE", description = "sortie archive, or .csv/.xlsx")
    Path input;

    @Option(names = "--to", required = true, paramLabel = "DEST",
            description = "udp://HOST:PORT, or kafka://BOOTSTRAP/PREFIX (records go to PREFIX.frames)")
    String to;

    @Option(names = "--speed", defaultValue = "1", paramLabel = "X",
            description = "0.1 to 100 times real time, or max (default: ${DEFAULT-VALUE})")
    String speed;

    @Option(names = "--from", paramLabel = "S", description = "start this many seconds after the first packet")
    Double fromS;

    @Option(names = "--from-record", paramLabel = "TYPE[:N]",
            description = "start at the N-th (default first) stored record of TYPE, for example event:3 (archives)")
    String fromRecord;

    @Option(names = "--dictionary", paramLabel = "FILE",
            description = "dictionary of a CSV/XLSX input (default: the demo one)")
    Path dictionaryFile;

    @Option(names = "--stream-id", defaultValue = "1", paramLabel = "N",
            description = "stream id of a CSV/XLSX input on the wire (default: ${DEFAULT-VALUE})")
    int streamId;

    @Spec
    CommandSpec spec;

    @Override
    public Integer call() {
        double x = ReplayControl.parseSpeed(speed);
        Destination dest = Destination.parse(to);
        PrintWriter out = spec.commandLine().getOut();
        boolean archive = input.getFileName() != null
                && input.getFileName().toString().toLowerCase(Locale.ROOT).endsWith(ArchiveFormat.EXTENSION);
        ArchiveReader reader = null;
        try {
            ReplaySource source;
            long startNs = Long.MIN_VALUE;
            if (archive) {
                reader = ArchiveReader.open(input);
                for (String line : reader.healthLines()) {
                    spec.commandLine().getErr().println(line);
                }
                source = new ArchiveSource(reader);
                if (fromRecord != null) {
                    startNs = recordTime((ArchiveSource) source);
                } else if (fromS != null) {
                    startNs = reader.firstTimeNs() + seconds(fromS);
                }
            } else {
                if (fromRecord != null) {
                    throw new IllegalArgumentException(input + ": --from-record needs a sortie archive; a CSV/XLSX "
                            + "file stores no records");
                }
                ParameterDictionary dict = dictionaryFile == null ? DemoFiles.dictionary()
                        : DictionaryFiles.load(dictionaryFile);
                source = new FileSource(input, dict, ReadOptions.DEFAULTS, streamId, WireOptions.DEFAULT);
                if (fromS != null) {
                    startNs = seconds(fromS);
                }
            }
            ReplayTarget target = open(dest);
            ReplayControl control = new ReplayControl(x, false);
            if (startNs != Long.MIN_VALUE) {
                control.seek(startNs);
            }
            out.println("replaying " + input + " to " + to + " at " + (x == ReplayControl.MAX_SPEED ? "max speed"
                    : x + " x real time"));
            out.flush();
            ReplaySummary s;
            try {
                s = new Replayer(source, target, ReplayClock.SYSTEM, control).run();
            } finally {
                target.close();
            }
            out.println("replayed: " + s.line());
            if (source instanceof FileSource fs && fs.lastReport() != null) {
                for (String l : fs.lastReport().lines()) {
                    out.println(l);
                }
            }
            out.flush();
            return 0;
        } finally {
            if (reader != null) {
                reader.close();
            }
        }
    }

    private long recordTime(ArchiveSource source) {
        String type = fromRecord;
        int n = 1;
        int colon = fromRecord.lastIndexOf(':');
        if (colon > 0) {
            type = fromRecord.substring(0, colon);
            try {
                n = Integer.parseInt(fromRecord.substring(colon + 1));
            } catch (NumberFormatException e) {
                n = 0;
            }
            if (n < 1) {
                throw new IllegalArgumentException("--from-record " + fromRecord + ": N must be a whole number from 1");
            }
        }
        List<Long> points = source.pointsOf(type);
        if (points.size() < n) {
            throw new IllegalArgumentException(input + ": --from-record " + fromRecord + ": the archive holds "
                    + points.size() + " records of type '" + type + "'");
        }
        return points.get(n - 1);
    }

    private static long seconds(double s) {
        if (!(s >= 0) || Double.isInfinite(s)) {
            throw new IllegalArgumentException("--from must be 0 or more seconds, got " + s);
        }
        return (long) (s * 1e9);
    }

    private static ReplayTarget open(Destination d) {
        if (d.isUdp()) {
            return ReplayTargets.udp(new UdpSender(UdpSenderConfig.to(d.udp())));
        }
        KafkaSettings settings = KafkaSettings.of(d.bootstrap()).withTopicPrefix(d.prefix());
        return ReplayTargets.kafka(new KafkaFrameSink(settings));
    }
}
