package org.pointcall.ingest.kafka;

import java.util.Locale;

/**
 * The {@link KafkaBench} measurement of our sink, run in its own JVM: sends the records as fast as the sink takes
 * them, waits for every acknowledgement, and prints {@code delivered}, {@code failed} and {@code rate} lines.
 * Arguments: bootstrap, topic prefix, records, record bytes, streams, linger ms, batch bytes.
 */
final class SinkThroughput {
    private SinkThroughput() {
    }

    public static void main(String[] args) {
        KafkaSettings settings = KafkaSettings.of(args[0]).withTopicPrefix(args[1])
                .withClientProperty("linger.ms", args[5]).withClientProperty("batch.size", args[6]);
        long records = Long.parseLong(args[2]);
        int size = Integer.parseInt(args[3]);
        int streams = Integer.parseInt(args[4]);
        byte[] template = new byte[size];
        for (int i = 0; i < size; i++) {
            template[i] = (byte) (i * 31 + 7);
        }
        long start;
        long end;
        KafkaFrameSink.SinkCounters c;
        try (KafkaFrameSink sink = new KafkaFrameSink(settings)) {
            start = System.nanoTime();
            int stream = 0;
            for (long i = 0; i < records; i++) {
                // a fresh packet per record, as the wire encoder hands over; the sequence number makes each unique
                byte[] packet = template.clone();
                packet[0] = (byte) (i >>> 24);
                packet[1] = (byte) (i >>> 16);
                packet[2] = (byte) (i >>> 8);
                packet[3] = (byte) i;
                sink.send(stream, packet);
                if (++stream == streams) {
                    stream = 0;
                }
            }
            sink.flush();
            end = System.nanoTime();
            c = sink.counters();
        }
        System.out.println("delivered: " + c.delivered() + " count");
        System.out.println("failed: " + c.failed() + " count");
        System.out.println("rate: " + String.format(Locale.ROOT, "%.1f", c.delivered() / ((end - start) / 1e9))
                + " records/s");
    }
}
