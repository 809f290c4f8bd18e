package org.pointcall.ingest.kafka;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Collections;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Set;
import java.util.TreeMap;
import java.util.regex.Pattern;

import org.apache.kafka.clients.CommonClientConfigs;
import org.apache.kafka.clients.admin.AdminClientConfig;
import org.apache.kafka.clients.consumer.ConsumerConfig;
import org.apache.kafka.clients.producer.ProducerConfig;
import org.apache.kafka.common.config.ConfigDef;
import org.apache.kafka.common.config.ConfigException;
import org.pointcall.shared.error.InputRejectedException;

/**
 * Where and how pointcall talks to Kafka: the brokers, the topic prefix ({@code <prefix>.frames}, {@code .events},
 * {@code .dictionary}), the consumer group, and any other Kafka client setting passed through unchanged (typically
 * TLS and SASL: {@code security.protocol}, {@code ssl.truststore.location}, {@code sasl.mechanism},
 * {@code sasl.jaas.config}, ...).
 *
 * <p>{@link #toString()} and {@link #maskedClientProperties()} hide passwords and JAAS configurations, so settings
 * may be logged. Settings that pointcall fixes to keep its delivery guarantees (serialisers, {@code acks},
 * idempotence, offset commits, start position) are refused, as are names that are no Kafka client setting.
 *
 * @param bootstrapServers comma-separated {@code host:port} list
 * @param topicPrefix      prefix of the three topic names: letters, digits, '.', '_' and '-'
 * @param groupId          consumer group, or {@code null} for a node that only produces; consumers with different
 *                         groups each see every frame, consumers of one group share the partitions
 * @param clientProperties other Kafka client settings, passed to each client that knows them
 */
public record KafkaSettings(String bootstrapServers, String topicPrefix, String groupId,
                            Map<String, String> clientProperties) {
    /** Settings file key of the broker list (Kafka's own name). */
    public static final String BOOTSTRAP_KEY = CommonClientConfigs.BOOTSTRAP_SERVERS_CONFIG;
    /** Settings file key of the topic prefix. */
    public static final String PREFIX_KEY = "topic.prefix";
    /** Settings file key of the consumer group (Kafka's own name). */
    public static final String GROUP_KEY = CommonClientConfigs.GROUP_ID_CONFIG;
    public static final String DEFAULT_PREFIX = "pointcall";

    private static final String HIDDEN = "[hidden]";
    private static final Pattern PREFIX = Pattern.compile("[A-Za-z0-9._-]+");
    /** Kafka's limit on a topic name's length. */
    private static final int MAX_TOPIC_LENGTH = 249;

    /** Settings pointcall sets itself, with the reason a user sees when a file tries to change one. */
    private static final Map<String, String> FIXED = fixed();
    /** Every producer, consumer and admin client setting Kafka knows, by name. */
    private static final Map<String, ConfigDef.ConfigKey> KNOWN = known();

    public KafkaSettings {
        Objects.requireNonNull(bootstrapServers, "bootstrapServers");
        Objects.requireNonNull(topicPrefix, "topicPrefix");
        Objects.requireNonNull(clientProperties, "clientProperties");
        String problem = bootstrapProblem(bootstrapServers);
        if (problem == null) {
            problem = prefixProblem(topicPrefix);
        }
        if (problem == null && groupId != null && groupId.isBlank()) {
            problem = GROUP_KEY + " is blank";
        }
        if (problem != null) {
            throw new IllegalArgumentException(problem);
        }
        TreeMap<String, String> copy = new TreeMap<>();
        for (Map.Entry<String, String> e : clientProperties.entrySet()) {
            String key = Objects.requireNonNull(e.getKey(), "client property name");
            String value = Objects.requireNonNull(e.getValue(), "client property value");
            String p = keyProblem(key);
            if (p == null) {
                p = valueProblem(key, value);
            }
            if (p != null) {
                throw new IllegalArgumentException(p);
            }
            copy.put(key, value);
        }
        clientProperties = Collections.unmodifiableMap(copy);
    }

    /** Settings for {@code bootstrapServers} with the default prefix, no group and no other client setting. */
    public static KafkaSettings of(String bootstrapServers) {
        return new KafkaSettings(bootstrapServers, DEFAULT_PREFIX, null, Map.of());
    }

    /**
     * Reads a settings file (Java properties syntax, UTF-8). Every problem is collected and reported together with
     * file, line and column.
     *
     * @throws InputRejectedException when the file has any problem
     * @throws org.pointcall.shared.error.PointcallException when the file cannot be read
     */
    public static KafkaSettings load(Path file) {
        return SettingsFileReader.read(file);
    }

    public KafkaSettings withTopicPrefix(String prefix) {
        return new KafkaSettings(bootstrapServers, prefix, groupId, clientProperties);
    }

    public KafkaSettings withGroupId(String group) {
        return new KafkaSettings(bootstrapServers, topicPrefix, group, clientProperties);
    }

    public KafkaSettings withClientProperty(String key, String value) {
        Map<String, String> m = new HashMap<>(clientProperties);
        m.put(key, value);
        return new KafkaSettings(bootstrapServers, topicPrefix, groupId, m);
    }

    public String framesTopic() {
        return KafkaTopics.frames(topicPrefix);
    }

    public String eventsTopic() {
        return KafkaTopics.events(topicPrefix);
    }

    public String dictionaryTopic() {
        return KafkaTopics.dictionary(topicPrefix);
    }

    /** Configuration for a producer: brokers plus the client properties a producer knows. */
    public Map<String, Object> producerConfig() {
        return clientConfig(ProducerConfig.configNames(), false);
    }

    /** Configuration for a consumer: brokers, group (when set) plus the client properties a consumer knows. */
    public Map<String, Object> consumerConfig() {
        return clientConfig(ConsumerConfig.configNames(), true);
    }

    /** Configuration for an admin client: brokers plus the client properties an admin client knows. */
    public Map<String, Object> adminConfig() {
        return clientConfig(AdminClientConfig.configNames(), false);
    }

    /** The client properties with every password and JAAS configuration replaced by {@value #HIDDEN}. */
    public Map<String, String> maskedClientProperties() {
        Map<String, String> out = new LinkedHashMap<>();
        clientProperties.forEach((k, v) -> out.put(k, isSecret(k) ? HIDDEN : v));
        return out;
    }

    @Override
    public String toString() {
        return "KafkaSettings[bootstrapServers=" + bootstrapServers + ", topicPrefix=" + topicPrefix + ", groupId="
                + groupId + ", clientProperties=" + maskedClientProperties() + "]";
    }

    private Map<String, Object> clientConfig(Set<String> names, boolean withGroup) {
        Map<String, Object> m = new HashMap<>();
        clientProperties.forEach((k, v) -> {
            if (names.contains(k)) {
                m.put(k, v);
            }
        });
        m.put(BOOTSTRAP_KEY, bootstrapServers);
        if (withGroup && groupId != null) {
            m.put(GROUP_KEY, groupId);
        }
        return m;
    }

    /** True when the setting holds a secret that must never be shown. */
    static boolean isSecret(String key) {
        ConfigDef.ConfigKey k = KNOWN.get(key);
        String lower = key.toLowerCase(java.util.Locale.ROOT);
        return (k != null && k.type == ConfigDef.Type.PASSWORD) || lower.contains("password")
                || lower.contains("jaas") || lower.contains("secret");
    }

    /** Why {@code key} cannot be a client property, or null when it can. */
    static String keyProblem(String key) {
        if (key.equals(BOOTSTRAP_KEY) || key.equals(PREFIX_KEY) || key.equals(GROUP_KEY)) {
            return "'" + key + "' is a main setting, not a client property";
        }
        String reason = FIXED.get(key);
        if (reason != null) {
            return "'" + key + "' is fixed by pointcall (" + reason + "); remove this line";
        }
        if (!KNOWN.containsKey(key)) {
            String near = nearest(key);
            return "unknown setting '" + key + "': not a Kafka client setting"
                    + (near == null ? ", nor " + BOOTSTRAP_KEY + ", " + PREFIX_KEY + " or " + GROUP_KEY
                            : "; did you mean '" + near + "'?");
        }
        return null;
    }

    /** Why {@code value} does not suit the Kafka setting {@code key} (which must be known), or null. */
    static String valueProblem(String key, String value) {
        ConfigDef.ConfigKey k = KNOWN.get(key);
        if (value.isBlank()) {
            return "'" + key + "' has no value";
        }
        Object parsed;
        try {
            parsed = ConfigDef.parseType(key, value, k.type);
        } catch (ConfigException e) {
            return "'" + key + "' needs " + article(k.type) + ", got '" + value + "'";
        }
        if (k.validator != null) {
            try {
                k.validator.ensureValid(key, parsed);
            } catch (ConfigException e) {
                return validatorProblem(key, value, k.validator, e);
            }
        }
        return null;
    }

    private static String validatorProblem(String key, String value, ConfigDef.Validator v, ConfigException e) {
        String shown = isSecret(key) ? "(value hidden)" : "'" + value + "'";
        String choices = v.toString();
        int open = choices.indexOf('[');
        if ((v instanceof ConfigDef.ValidString || v instanceof ConfigDef.CaseInsensitiveValidString) && open >= 0
                && choices.endsWith("]")) {
            // Kafka lists the choices in hash order; sorted they read better and stay the same from run to run
            List<String> sorted = new ArrayList<>(List.of(choices.substring(open + 1, choices.length() - 1)
                    .split(",\\s*")));
            Collections.sort(sorted);
            return "'" + key + "' must be one of " + String.join(", ", sorted)
                    + (v instanceof ConfigDef.CaseInsensitiveValidString ? " (any case)" : "") + ", got " + shown;
        }
        String reason = e.getMessage();
        String kafkaPrefix = "Invalid value " + value + " for configuration " + key + ": ";
        if (reason != null && reason.startsWith(kafkaPrefix)) {
            reason = reason.substring(kafkaPrefix.length());
        } else if (isSecret(key)) {
            reason = "rejected by Kafka";
        }
        return "bad value " + shown + " for '" + key + "': " + reason;
    }

    static String bootstrapProblem(String servers) {
        if (servers.isBlank()) {
            return BOOTSTRAP_KEY + " is empty (host:port of at least one broker)";
        }
        for (String entry : servers.split(",", -1)) {
            String s = entry.strip();
            int colon = s.lastIndexOf(':');
            if (colon <= 0 || colon == s.length() - 1) {
                return BOOTSTRAP_KEY + " entry '" + s + "' needs host:port";
            }
            String port = s.substring(colon + 1);
            int p;
            try {
                p = Integer.parseInt(port);
            } catch (NumberFormatException e) {
                return BOOTSTRAP_KEY + " entry '" + s + "' has port '" + port + "', not a number";
            }
            if (p < 1 || p > 65535) {
                return BOOTSTRAP_KEY + " entry '" + s + "' has port " + p + ", outside 1 to 65535";
            }
        }
        return null;
    }

    static String prefixProblem(String prefix) {
        if (!PREFIX.matcher(prefix).matches()) {
            return PREFIX_KEY + " '" + prefix + "' may hold only letters, digits, '.', '_' and '-'";
        }
        int longest = KafkaTopics.dictionary(prefix).length();
        if (longest > MAX_TOPIC_LENGTH) {
            return PREFIX_KEY + " is too long: topic names are limited to " + MAX_TOPIC_LENGTH + " characters";
        }
        return null;
    }

    private static String article(ConfigDef.Type type) {
        switch (type) {
            case BOOLEAN:
                return "true or false";
            case INT:
            case SHORT:
            case LONG:
                return "a whole number";
            case DOUBLE:
                return "a number";
            case LIST:
                return "a comma-separated list";
            case CLASS:
                return "a class name";
            default:
                return "a " + type.name().toLowerCase(java.util.Locale.ROOT);
        }
    }

    /** The known setting nearest to a misspelt name (at most two edits away), or null. */
    private static String nearest(String key) {
        String best = null;
        int bestD = 3;
        for (String name : KNOWN.keySet()) {
            if (Math.abs(name.length() - key.length()) >= bestD) {
                continue;
            }
            int d = editDistance(key, name);
            if (d < bestD) {
                bestD = d;
                best = name;
            }
        }
        return best;
    }

    private static int editDistance(String a, String b) {
        int[] prev = new int[b.length() + 1];
        int[] cur = new int[b.length() + 1];
        for (int j = 0; j <= b.length(); j++) {
            prev[j] = j;
        }
        for (int i = 1; i <= a.length(); i++) {
            cur[0] = i;
            for (int j = 1; j <= b.length(); j++) {
                int sub = prev[j - 1] + (a.charAt(i - 1) == b.charAt(j - 1) ? 0 : 1);
                cur[j] = Math.min(sub, Math.min(prev[j] + 1, cur[j - 1] + 1));
            }
            int[] t = prev;
            prev = cur;
            cur = t;
        }
        return prev[b.length()];
    }

    private static Map<String, String> fixed() {
        Map<String, String> m = new HashMap<>();
        String serde = "stream id keys and wire packets are raw bytes";
        m.put(ProducerConfig.KEY_SERIALIZER_CLASS_CONFIG, serde);
        m.put(ProducerConfig.VALUE_SERIALIZER_CLASS_CONFIG, serde);
        m.put(ConsumerConfig.KEY_DESERIALIZER_CLASS_CONFIG, serde);
        m.put(ConsumerConfig.VALUE_DESERIALIZER_CLASS_CONFIG, serde);
        String noLoss = "acks=all with idempotence, so no frame is lost or doubled";
        m.put(ProducerConfig.ACKS_CONFIG, noLoss);
        m.put(ProducerConfig.ENABLE_IDEMPOTENCE_CONFIG, noLoss);
        m.put(ConsumerConfig.ENABLE_AUTO_COMMIT_CONFIG, "offsets are committed after the frames are handled");
        m.put(ConsumerConfig.AUTO_OFFSET_RESET_CONFIG, "each role chooses where a new group starts");
        return Map.copyOf(m);
    }

    private static Map<String, ConfigDef.ConfigKey> known() {
        Map<String, ConfigDef.ConfigKey> m = new HashMap<>();
        m.putAll(AdminClientConfig.configDef().configKeys());
        m.putAll(ConsumerConfig.configDef().configKeys());
        m.putAll(ProducerConfig.configDef().configKeys());
        return Map.copyOf(m);
    }
}
