package org.pointcall.ui.share;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;

import org.pointcall.ingest.kafka.KafkaSettings;
import org.pointcall.shared.error.PointcallException;

/**
 * Where a session is shared or watched, as written on a command line: {@code kafka://HOST:PORT[,HOST:PORT...][/PREFIX]}
 * (prefix {@value KafkaSettings#DEFAULT_PREFIX} when left out), or the path of a Kafka settings file (brokers,
 * prefix, TLS and SASL; see the {@code ingest.kafka} package) for a broker that needs more than an address.
 */
public final class ShareAddress {
    private ShareAddress() {
    }

    /**
     * The Kafka settings {@code text} names.
     *
     * @param option the option, for the message ({@code --share})
     * @throws PointcallException naming the option and what is wrong
     */
    public static KafkaSettings parse(String text, String option) {
        String t = text.strip();
        if (t.toLowerCase(Locale.ROOT).startsWith("kafka://")) {
            String rest = t.substring("kafka://".length());
            int slash = rest.indexOf('/');
            String servers = slash < 0 ? rest : rest.substring(0, slash);
            String prefix = slash < 0 || slash == rest.length() - 1 ? KafkaSettings.DEFAULT_PREFIX
                    : rest.substring(slash + 1);
            try {
                return KafkaSettings.of(servers).withTopicPrefix(prefix);
            } catch (IllegalArgumentException e) {
                throw new PointcallException(option + " '" + text + "': " + e.getMessage()
                        + " (give kafka://HOST:PORT/PREFIX, for example kafka://127.0.0.1:9092/range1)");
            }
        }
        Path file = Path.of(t);
        if (t.contains("://") || !Files.isRegularFile(file)) {
            throw new PointcallException(option + " '" + text + "': give kafka://HOST:PORT[/PREFIX] or a Kafka "
                    + "settings file");
        }
        return KafkaSettings.load(file);
    }

    /** {@code kafka://servers/prefix}, for messages (no secret is ever in it). */
    public static String describe(KafkaSettings s) {
        return "kafka://" + s.bootstrapServers() + "/" + s.topicPrefix();
    }
}
