package org.pointcall.models.modelfile;

import java.io.IOException;
import java.time.Instant;
import java.time.format.DateTimeParseException;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

import org.pointcall.ingest.window.ExtractorSettings;
import org.pointcall.ingest.window.InvalidWindowPolicy;
import org.pointcall.ingest.window.WindowSpec;
import org.pointcall.shared.units.Unit;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;

/** The metadata block as JSON, written and read field by field so that the format does not follow code renames. */
final class MetadataJson {
    static final String FORMAT_NAME = "pointcall-model";

    private static final ObjectMapper MAPPER = new ObjectMapper().enable(SerializationFeature.INDENT_OUTPUT);

    private MetadataJson() {
    }

    /** A field of the metadata is missing or wrong; the message names it by its JSON path. */
    static final class BadMetadata extends Exception {
        private static final long serialVersionUID = 1L;

        BadMetadata(String message) {
            super(message);
        }
    }

    static byte[] write(ModelMetadata m) {
        ObjectNode root = MAPPER.createObjectNode();
        ModelDescription d = m.description();
        root.put("format", FORMAT_NAME);
        root.put("formatVersion", m.formatVersion());
        root.put("created", m.created().toString());
        ObjectNode libs = root.putObject("libraries");
        m.libraries().forEach(libs::put);
        ArrayNode params = root.putArray("parameters");
        for (RequiredParameter p : d.parameters()) {
            params.addObject().put("name", p.name()).put("unit", p.unit().symbol());
        }
        ArrayNode windows = root.putArray("windows");
        for (WindowSpec w : d.windows()) {
            ObjectNode o = windows.addObject();
            o.put("parameter", w.parameter());
            ArrayNode lengths = o.putArray("lengthsS");
            w.windowsS().forEach(lengths::add);
            if (Double.isNaN(w.maxGapS())) {
                o.putNull("maxGapS");
            } else {
                o.put("maxGapS", w.maxGapS());
            }
        }
        ExtractorSettings x = d.extractor();
        root.putObject("decision").put("rateHz", x.decisionRateHz()).put("gapFactor", x.gapFactor())
                .put("minSamples", x.minSamples()).put("invalidWindow", x.invalidWindow().name());
        ArrayNode features = root.putArray("features");
        d.features().forEach(features::add);
        ArrayNode classes = root.putArray("classes");
        d.classes().forEach(classes::add);
        TrainingSummary t = d.training();
        ObjectNode tr = root.putObject("training");
        ArrayNode sets = tr.putArray("datasets");
        t.datasets().forEach(sets::add);
        ObjectNode rows = tr.putObject("rowsPerClass");
        t.rowsPerClass().forEach(rows::put);
        tr.put("balance", t.balance());
        tr.put("classifier", t.classifier());
        ObjectNode settings = tr.putObject("classifierSettings");
        t.classifierSettings().forEach(settings::put);
        ObjectNode cv = tr.putObject("crossValidation");
        t.crossValidation().forEach(cv::put);
        root.putObject("payload").put("class", m.payloadClass()).put("bytes", m.payloadBytes())
                .put("sha256", m.payloadSha256());
        try {
            return MAPPER.writeValueAsBytes(root);
        } catch (JsonProcessingException e) {
            throw new IllegalStateException("metadata cannot be written as JSON", e);
        }
    }

    static ModelMetadata read(byte[] json) throws BadMetadata {
        JsonNode root;
        try {
            root = MAPPER.readTree(json);
        } catch (JsonProcessingException e) {
            throw new BadMetadata("not JSON: " + e.getOriginalMessage() + (e.getLocation() == null ? ""
                    : " (metadata line " + e.getLocation().getLineNr() + ", column " + e.getLocation().getColumnNr()
                    + ")"));
        } catch (IOException e) {
            throw new BadMetadata("not JSON: " + e.getMessage());
        }
        if (root == null || !root.isObject()) {
            throw new BadMetadata("not a JSON object");
        }
        String format = text(root, "format");
        if (!FORMAT_NAME.equals(format)) {
            throw new BadMetadata("format is '" + format + "', expected '" + FORMAT_NAME + "'");
        }
        int version = (int) integer(root, "formatVersion");
        Instant created;
        try {
            created = Instant.parse(text(root, "created"));
        } catch (DateTimeParseException e) {
            throw new BadMetadata("created: '" + root.get("created").asText() + "' is not an ISO-8601 instant");
        }
        Map<String, String> libraries = new LinkedHashMap<>();
        for (Map.Entry<String, JsonNode> e : object(root, "libraries").properties()) {
            libraries.put(e.getKey(), e.getValue().asText());
        }
        List<RequiredParameter> params = new ArrayList<>();
        JsonNode pa = array(root, "parameters");
        for (int i = 0; i < pa.size(); i++) {
            String path = "parameters[" + i + "]";
            String name = text(pa.get(i), "name", path);
            String unit = text(pa.get(i), "unit", path);
            Unit u = Unit.bySymbol(unit).orElseThrow(() -> new BadMetadataUnchecked(path + ".unit: unknown unit '"
                    + unit + "'; units are " + Unit.knownSymbols()));
            params.add(new RequiredParameter(name, u));
        }
        List<WindowSpec> windows = new ArrayList<>();
        JsonNode wa = array(root, "windows");
        for (int i = 0; i < wa.size(); i++) {
            String path = "windows[" + i + "]";
            JsonNode w = wa.get(i);
            String parameter = text(w, "parameter", path);
            JsonNode ls = array(w, "lengthsS", path);
            List<Double> lengths = new ArrayList<>();
            for (int k = 0; k < ls.size(); k++) {
                if (!ls.get(k).isNumber()) {
                    throw new BadMetadata(path + ".lengthsS[" + k + "]: not a number");
                }
                lengths.add(ls.get(k).asDouble());
            }
            JsonNode gap = w.get("maxGapS");
            double gapS = gap == null || gap.isNull() ? Double.NaN : number(w, "maxGapS", path);
            windows.add(new WindowSpec(parameter, lengths, gapS));
        }
        JsonNode dec = object(root, "decision");
        String policy = text(dec, "invalidWindow", "decision");
        InvalidWindowPolicy invalid;
        try {
            invalid = InvalidWindowPolicy.valueOf(policy);
        } catch (IllegalArgumentException e) {
            throw new BadMetadata("decision.invalidWindow: '" + policy + "' is not one of "
                    + java.util.Arrays.toString(InvalidWindowPolicy.values()));
        }
        ExtractorSettings extractor = new ExtractorSettings(number(dec, "rateHz", "decision"),
                number(dec, "gapFactor", "decision"), (int) integer(dec, "minSamples", "decision"), invalid);
        List<String> features = texts(root, "features");
        List<String> classes = texts(root, "classes");
        JsonNode tr = object(root, "training");
        Map<String, Long> rows = new LinkedHashMap<>();
        for (Map.Entry<String, JsonNode> e : object(tr, "rowsPerClass", "training").properties()) {
            if (!e.getValue().canConvertToLong()) {
                throw new BadMetadata("training.rowsPerClass." + e.getKey() + ": not a whole number");
            }
            rows.put(e.getKey(), e.getValue().asLong());
        }
        Map<String, String> settings = new LinkedHashMap<>();
        for (Map.Entry<String, JsonNode> e : object(tr, "classifierSettings", "training").properties()) {
            settings.put(e.getKey(), e.getValue().asText());
        }
        Map<String, Double> cv = new LinkedHashMap<>();
        for (Map.Entry<String, JsonNode> e : object(tr, "crossValidation", "training").properties()) {
            if (!e.getValue().isNumber()) {
                throw new BadMetadata("training.crossValidation." + e.getKey() + ": not a number");
            }
            cv.put(e.getKey(), e.getValue().asDouble());
        }
        TrainingSummary training = new TrainingSummary(texts(tr, "datasets", "training"), rows,
                text(tr, "balance", "training"), text(tr, "classifier", "training"), settings, cv);
        JsonNode pl = object(root, "payload");
        return new ModelMetadata(version, new ModelDescription(params, windows, extractor, features, classes,
                training), libraries, created, text(pl, "class", "payload"), integer(pl, "bytes", "payload"),
                text(pl, "sha256", "payload"));
    }

    /** Carries a {@link BadMetadata} out of a lambda. */
    static final class BadMetadataUnchecked extends RuntimeException {
        private static final long serialVersionUID = 1L;

        BadMetadataUnchecked(String message) {
            super(message);
        }
    }

    private static JsonNode field(JsonNode n, String name, String path) throws BadMetadata {
        JsonNode v = n == null ? null : n.get(name);
        if (v == null || v.isNull()) {
            throw new BadMetadata((path.isEmpty() ? "" : path + ".") + name + " is missing");
        }
        return v;
    }

    private static String text(JsonNode n, String name) throws BadMetadata {
        return text(n, name, "");
    }

    private static String text(JsonNode n, String name, String path) throws BadMetadata {
        JsonNode v = field(n, name, path);
        if (!v.isTextual()) {
            throw new BadMetadata((path.isEmpty() ? "" : path + ".") + name + ": not a string");
        }
        return v.asText();
    }

    private static double number(JsonNode n, String name, String path) throws BadMetadata {
        JsonNode v = field(n, name, path);
        if (!v.isNumber()) {
            throw new BadMetadata((path.isEmpty() ? "" : path + ".") + name + ": not a number");
        }
        return v.asDouble();
    }

    private static long integer(JsonNode n, String name) throws BadMetadata {
        return integer(n, name, "");
    }

    private static long integer(JsonNode n, String name, String path) throws BadMetadata {
        JsonNode v = field(n, name, path);
        if (!v.isIntegralNumber() || !v.canConvertToLong()) {
            throw new BadMetadata((path.isEmpty() ? "" : path + ".") + name + ": not a whole number");
        }
        return v.asLong();
    }

    private static JsonNode object(JsonNode n, String name) throws BadMetadata {
        return object(n, name, "");
    }

    private static JsonNode object(JsonNode n, String name, String path) throws BadMetadata {
        JsonNode v = field(n, name, path);
        if (!v.isObject()) {
            throw new BadMetadata((path.isEmpty() ? "" : path + ".") + name + ": not an object");
        }
        return v;
    }

    private static JsonNode array(JsonNode n, String name) throws BadMetadata {
        return array(n, name, "");
    }

    private static JsonNode array(JsonNode n, String name, String path) throws BadMetadata {
        JsonNode v = field(n, name, path);
        if (!v.isArray()) {
            throw new BadMetadata((path.isEmpty() ? "" : path + ".") + name + ": not an array");
        }
        return v;
    }

    private static List<String> texts(JsonNode n, String name) throws BadMetadata {
        return texts(n, name, "");
    }

    private static List<String> texts(JsonNode n, String name, String path) throws BadMetadata {
        JsonNode a = array(n, name, path);
        List<String> out = new ArrayList<>(a.size());
        for (int i = 0; i < a.size(); i++) {
            if (!a.get(i).isTextual()) {
                throw new BadMetadata((path.isEmpty() ? "" : path + ".") + name + "[" + i + "]: not a string");
            }
            out.add(a.get(i).asText());
        }
        return out;
    }
}
