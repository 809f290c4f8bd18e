package org.pointcall.ingest.sim.truth;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;

import org.pointcall.shared.error.PointcallException;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.DeserializationFeature;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;

/**
 * The exact truth of a simulated sortie, written beside its telemetry as {@code truth.json}: the flown points, the
 * data's spoilers (dropouts, wild points) and what produced it (airframe, card, seed, rates), so that training and
 * evaluation can score against it.
 */
public record SortieTruth(String format, String airframe, String sortie, long seed, double frameRateHz,
                          double durationS, boolean cleanSensors, long framesDropped, long dropouts, long wildPoints,
                          List<PointTruth> points) {
    /** Format name and version of truth files. */
    public static final String FORMAT = "pointcall-sortie-truth/1";

    public SortieTruth {
        points = List.copyOf(points);
    }

    private static ObjectMapper mapper() {
        return new ObjectMapper()
                .enable(SerializationFeature.INDENT_OUTPUT)
                .enable(SerializationFeature.ORDER_MAP_ENTRIES_BY_KEYS)
                .disable(DeserializationFeature.FAIL_ON_UNKNOWN_PROPERTIES);
    }

    public String toJson() {
        try {
            return mapper().writeValueAsString(this) + "\n";
        } catch (JsonProcessingException e) {
            throw new IllegalStateException("truth cannot be written as JSON", e);
        }
    }

    public void write(Path file) {
        try {
            Files.writeString(file, toJson());
        } catch (IOException e) {
            throw new PointcallException("cannot write " + file + ": " + e.getMessage(), e);
        }
    }

    public static SortieTruth read(Path file) {
        try {
            SortieTruth t = mapper().readValue(file.toFile(), SortieTruth.class);
            if (!FORMAT.equals(t.format())) {
                throw new PointcallException(file + ": not a sortie truth file (format '" + t.format()
                        + "', expected '" + FORMAT + "')");
            }
            return t;
        } catch (IOException e) {
            throw new PointcallException(file + ": cannot read the truth file: " + e.getMessage().lines().findFirst()
                    .orElse(""), e);
        }
    }

    /** Sorted copy, so JSON output is byte-stable whatever map a caller built. */
    public static Map<String, Double> sorted(Map<String, Double> m) {
        return new TreeMap<>(m);
    }
}
