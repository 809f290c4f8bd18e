package org.pointcall.ingest.kafka;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.TimeoutException;

import org.apache.kafka.clients.admin.Admin;
import org.apache.kafka.clients.admin.NewTopic;
import org.apache.kafka.clients.admin.OffsetSpec;
import org.apache.kafka.common.TopicPartition;
import org.apache.kafka.common.config.TopicConfig;
import org.apache.kafka.common.errors.RetriableException;
import org.apache.kafka.common.errors.TopicExistsException;
import org.pointcall.shared.error.PointcallException;

/**
 * Names of pointcall's topics and their creation. {@code <prefix>.frames} carries wire packets keyed by stream id,
 * {@code <prefix>.events} point events and verdicts, {@code <prefix>.dictionary} the parameter dictionaries keyed by
 * their hash, compacted so the latest dictionary of each hash is kept for ever.
 */
public final class KafkaTopics {
    private static final long ADMIN_TIMEOUT_S = 30;

    private KafkaTopics() {
    }

    public static String frames(String prefix) {
        return prefix + ".frames";
    }

    public static String events(String prefix) {
        return prefix + ".events";
    }

    public static String dictionary(String prefix) {
        return prefix + ".dictionary";
    }

    /**
     * Creates the three topics of {@code settings}' prefix that do not exist yet, with {@code partitions} partitions
     * for frames and events (the unit of sharing among a consumer group) and one for the dictionary.
     *
     * @return the names of the topics created, empty when all existed
     */
    public static List<String> ensure(KafkaSettings settings, int partitions, short replicationFactor) {
        try (Admin admin = Admin.create(settings.adminConfig())) {
            return ensure(admin, settings.topicPrefix(), partitions, replicationFactor);
        }
    }

    /**
     * Waits until every partition of the new topics answers at its leader. A topic is announced before its leaders
     * serve; an idempotent producer whose very first batch to a partition is refused then (not leader) while its
     * next batches get in can never place that first batch, and loses it at its delivery timeout (seen with Kafka
     * 4.4: the broker takes any first sequence number from a producer it has no state for).
     */
    private static void awaitServing(Admin admin, List<NewTopic> topics)
            throws InterruptedException, ExecutionException, TimeoutException {
        Map<TopicPartition, OffsetSpec> ask = new HashMap<>();
        for (NewTopic t : topics) {
            for (int p = 0; p < t.numPartitions(); p++) {
                ask.put(new TopicPartition(t.name(), p), OffsetSpec.latest());
            }
        }
        long deadline = System.nanoTime() + TimeUnit.SECONDS.toNanos(ADMIN_TIMEOUT_S);
        while (true) {
            try {
                admin.listOffsets(ask).all().get(ADMIN_TIMEOUT_S, TimeUnit.SECONDS);
                return;
            } catch (ExecutionException e) {
                if (!(e.getCause() instanceof RetriableException) || System.nanoTime() > deadline) {
                    throw e;
                }
                Thread.sleep(100);
            }
        }
    }

    /** As {@link #ensure(KafkaSettings, int, short)} with an admin client the caller owns. */
    public static List<String> ensure(Admin admin, String prefix, int partitions, short replicationFactor) {
        if (partitions < 1 || replicationFactor < 1) {
            throw new IllegalArgumentException("partitions and replication factor must be >= 1");
        }
        String where = "Kafka topics " + prefix + ".*";
        try {
            Set<String> existing = admin.listTopics().names().get(ADMIN_TIMEOUT_S, TimeUnit.SECONDS);
            List<NewTopic> wanted = new ArrayList<>();
            if (!existing.contains(frames(prefix))) {
                wanted.add(new NewTopic(frames(prefix), partitions, replicationFactor));
            }
            if (!existing.contains(events(prefix))) {
                wanted.add(new NewTopic(events(prefix), partitions, replicationFactor));
            }
            if (!existing.contains(dictionary(prefix))) {
                wanted.add(new NewTopic(dictionary(prefix), 1, replicationFactor)
                        .configs(Map.of(TopicConfig.CLEANUP_POLICY_CONFIG, TopicConfig.CLEANUP_POLICY_COMPACT)));
            }
            List<String> created = new ArrayList<>();
            if (wanted.isEmpty()) {
                return created;
            }
            var result = admin.createTopics(wanted).values();
            for (NewTopic t : wanted) {
                try {
                    result.get(t.name()).get(ADMIN_TIMEOUT_S, TimeUnit.SECONDS);
                    created.add(t.name());
                } catch (ExecutionException e) {
                    // another node created it between our listing and our request: that is what we wanted
                    if (!(e.getCause() instanceof TopicExistsException)) {
                        throw e;
                    }
                }
            }
            List<NewTopic> made = new ArrayList<>();
            for (NewTopic t : wanted) {
                if (created.contains(t.name())) {
                    made.add(t);
                }
            }
            awaitServing(admin, made);
            return created;
        } catch (ExecutionException e) {
            throw new PointcallException(where + ": cannot create (" + e.getCause().getMessage() + ")", e.getCause());
        } catch (TimeoutException e) {
            throw new PointcallException(where + ": no answer from the brokers within " + ADMIN_TIMEOUT_S + " s", e);
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new PointcallException(where + ": interrupted", e);
        }
    }
}
