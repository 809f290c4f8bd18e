package org.pointcall.ingest.kafka;

import java.util.Map;
import java.util.TreeMap;
import java.util.concurrent.ConcurrentHashMap;
import java.util.concurrent.atomic.LongAdder;

import org.slf4j.Logger;

/**
 * Counts faults by kind and logs only the first of each kind, so a broker outage or a stream of bad records cannot
 * flood the log while nothing is lost from the counts.
 */
final class ErrorTally {
    private final Logger log;
    private final ConcurrentHashMap<String, LongAdder> counts = new ConcurrentHashMap<>();

    ErrorTally(Logger log) {
        this.log = log;
    }

    /** Counts one fault of {@code kind}; the first of its kind is logged as {@code message} (a warning). */
    void count(String kind, String message) {
        LongAdder adder = counts.get(kind);
        if (adder == null) {
            LongAdder fresh = new LongAdder();
            adder = counts.putIfAbsent(kind, fresh);
            if (adder == null) {
                adder = fresh;
                log.warn("{} (first of its kind; later ones are only counted)", message);
            }
        }
        adder.increment();
    }

    long total() {
        long n = 0;
        for (LongAdder a : counts.values()) {
            n += a.sum();
        }
        return n;
    }

    /** Counts per kind, sorted by kind. */
    Map<String, Long> byKind() {
        Map<String, Long> out = new TreeMap<>();
        counts.forEach((k, v) -> out.put(k, v.sum()));
        return out;
    }
}
