package org.pointcall.models.data;

import java.nio.file.Path;
import java.util.List;
import java.util.function.DoubleUnaryOperator;

import org.pointcall.ingest.file.CsvWriter;
import org.pointcall.ingest.frame.Frame;
import org.pointcall.shared.dictionary.Parameter;
import org.pointcall.shared.dictionary.ParameterDictionary;
import org.pointcall.shared.units.Unit;

/** Small recordings written with the real CSV writer, for the data-set tests. */
final class TestRecordings {
    static final long S = 1_000_000_000L;

    private TestRecordings() {
    }

    /** KCAS and AoA at 20 Hz. */
    static ParameterDictionary dictionary() {
        return new ParameterDictionary("test-airframe", List.of(
                new Parameter("KCAS", Unit.KNOT, "calibrated airspeed", 20, 0, 600, null, null, null),
                new Parameter("AoA", Unit.DEGREE, "angle of attack", 20, -20, 40, null, null, null)));
    }

    /** {@code seconds} of data at 20 Hz from t = 0, KCAS and AoA given as functions of time in s. */
    static Path write(Path file, double seconds, DoubleUnaryOperator kcas, DoubleUnaryOperator aoa) {
        ParameterDictionary dict = dictionary();
        try (CsvWriter w = CsvWriter.create(file, dict)) {
            Frame f = Frame.forDictionary(dict);
            int n = (int) Math.round(seconds * 20);
            for (int i = 0; i < n; i++) {
                long t = i * 50_000_000L;
                double ts = t / 1e9;
                f.clear();
                f.timeNs(t);
                f.sequence(i);
                f.value(0, kcas.applyAsDouble(ts));
                f.value(1, aoa.applyAsDouble(ts));
                w.onFrame(f);
            }
        }
        return file;
    }
}
