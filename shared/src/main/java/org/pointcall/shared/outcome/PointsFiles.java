package org.pointcall.shared.outcome;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;

import org.pointcall.shared.error.PointcallException;
import org.pointcall.shared.kind.ManoeuvreKind;
import org.pointcall.shared.kind.MetricSpec;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.DeserializationFeature;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;

/**
 * Writes and reads {@code points.json} and writes {@code points.csv}; turns session events into JSON records and
 * back (for a recorder).
 */
public final class PointsFiles {
    /** File name of the JSON points file. */
    public static final String JSON_FILE = "points.json";
    /** File name of the CSV points file. */
    public static final String CSV_FILE = "points.csv";

    private static final ObjectMapper MAPPER = new ObjectMapper()
            .enable(SerializationFeature.INDENT_OUTPUT)
            .enable(SerializationFeature.ORDER_MAP_ENTRIES_BY_KEYS)
            .disable(DeserializationFeature.FAIL_ON_UNKNOWN_PROPERTIES);
    private static final ObjectMapper COMPACT = MAPPER.copy().disable(SerializationFeature.INDENT_OUTPUT);

    private PointsFiles() {
    }

    public static String toJson(PointsFile file) {
        try {
            return MAPPER.writeValueAsString(file) + "\n";
        } catch (JsonProcessingException e) {
            throw new IllegalStateException("points cannot be written as JSON", e);
        }
    }

    /** Reads a points file's text; {@code source} names it in messages. */
    public static PointsFile fromJson(String text, String source) {
        PointsFile f;
        try {
            f = MAPPER.readValue(text, PointsFile.class);
        } catch (IOException e) {
            throw new PointcallException(source + ": not a readable points file: " + firstLine(e.getMessage()), e);
        }
        if (!PointsFile.FORMAT.equals(f.format())) {
            throw new PointcallException(source + ": not a points file (format '" + f.format() + "', expected '"
                    + PointsFile.FORMAT + "')");
        }
        return f;
    }

    public static PointsFile read(Path file) {
        try {
            return fromJson(Files.readString(file, StandardCharsets.UTF_8), file.toString());
        } catch (IOException e) {
            throw new PointcallException(file + ": cannot read: " + e.getMessage(), e);
        }
    }

    /** Writes {@code dir/points.json} and {@code dir/points.csv} (dir created if missing); returns both paths. */
    public static List<Path> write(Path dir, PointsFile file) {
        try {
            Files.createDirectories(dir);
            Path json = dir.resolve(JSON_FILE);
            Path csv = dir.resolve(CSV_FILE);
            Files.writeString(json, toJson(file), StandardCharsets.UTF_8);
            Files.writeString(csv, toCsv(file), StandardCharsets.UTF_8);
            return List.of(json, csv);
        } catch (IOException e) {
            throw new PointcallException("cannot write the points files in " + dir + ": " + e.getMessage(), e);
        }
    }

    /**
     * One row per point: card id, kind, begin and end (s of data time), the tool's verdict, the engineer's call, the
     * call that stands, confidence, reasons joined by {@code "; "}, then one column per metric of the kinds present,
     * named {@code metric (unit)} and left empty where a point's kind lacks it or it could not be computed.
     */
    public static String toCsv(PointsFile file) {
        Map<String, String> columns = new LinkedHashMap<>();
        for (ManoeuvreKind k : ManoeuvreKind.values()) {
            boolean present = file.points().stream().anyMatch(p -> p.kind().equals(k.key()));
            if (!present) {
                continue;
            }
            for (MetricSpec ms : k.metrics()) {
                columns.putIfAbsent(ms.name() + " (" + ms.unit().symbol() + ")", ms.name());
            }
        }
        StringBuilder b = new StringBuilder();
        List<String> head = new ArrayList<>(List.of("card_id", "kind", "begin_s", "end_s", "verdict",
                "engineer_call", "final_call", "confidence", "reasons"));
        head.addAll(columns.keySet());
        row(b, head);
        for (PointOutcome p : file.points()) {
            List<String> r = new ArrayList<>();
            r.add(p.cardId() == null ? "" : p.cardId());
            r.add(p.kind());
            r.add(String.format(Locale.ROOT, "%.3f", p.beginNs() / 1e9));
            r.add(String.format(Locale.ROOT, "%.3f", p.endNs() / 1e9));
            r.add(p.verdict() == null ? "" : p.verdict().key());
            r.add(p.operatorCall() == null ? "" : p.operatorCall().call().key());
            r.add(p.finalCall() == null ? "" : p.finalCall().key());
            r.add(String.format(Locale.ROOT, "%.3f", p.confidence()));
            r.add(String.join("; ", p.reasons().stream().map(Reason::text).toList()));
            for (Map.Entry<String, String> c : columns.entrySet()) {
                MetricValue m = p.metric(c.getValue());
                boolean sameUnit = m != null && c.getKey().endsWith("(" + m.unit() + ")");
                r.add(sameUnit ? Numbers.near(m.value(), 6) : "");
            }
            row(b, r);
        }
        return b.toString();
    }

    private static void row(StringBuilder b, List<String> cells) {
        for (int i = 0; i < cells.size(); i++) {
            if (i > 0) {
                b.append(',');
            }
            String c = cells.get(i);
            if (c.indexOf(',') >= 0 || c.indexOf('"') >= 0 || c.indexOf('\n') >= 0) {
                b.append('"').append(c.replace("\"", "\"\"")).append('"');
            } else {
                b.append(c);
            }
        }
        b.append('\n');
    }

    /** One event as a one-line JSON record, its type in {@code event}. */
    public static String eventToJson(SessionEvent event) {
        try {
            return COMPACT.writerFor(SessionEvent.class).writeValueAsString(event);
        } catch (JsonProcessingException e) {
            throw new IllegalStateException("event cannot be written as JSON", e);
        }
    }

    /** An event back from its JSON record. */
    public static SessionEvent eventFromJson(String json) {
        try {
            return COMPACT.readValue(json, SessionEvent.class);
        } catch (IOException e) {
            throw new PointcallException("not a session event record: " + firstLine(e.getMessage()), e);
        }
    }

    private static String firstLine(String s) {
        return s == null ? "" : s.lines().findFirst().orElse("");
    }
}
