package org.pointcall.models.train;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;

import org.junit.jupiter.api.Test;
import org.pointcall.ingest.window.WindowSpec;
import org.pointcall.models.data.LabelledRows;
import org.pointcall.models.modelfile.ModelDescription;
import org.pointcall.shared.error.InputRejectedException;

class FeatureMapTest {
    /** KCAS (a scaled level), AoA (a level) and Q (not a level), as the extractor names them. */
    static final List<String> NAMES = ModelDescription.featureNames(List.of(WindowSpec.of("KCAS", 1.0, 30.0),
            WindowSpec.of("AoA", 1.0, 30.0), WindowSpec.of("Q", 1.0)));

    private static int at(List<String> names, String name) {
        int i = names.indexOf(name);
        assertTrue(i >= 0, name + " in " + names);
        return i;
    }

    @Test
    void levelsBecomeDifferencesFromTheLongestMeanAndSpeedsAShareOfIt() {
        FeatureMap m = FeatureMap.relative(NAMES);
        assertEquals(NAMES.size(), m.inputCount());
        List<String> out = m.outputNames();
        // the two baselines themselves are left out; every window with min and max gains a range
        assertTrue(!out.contains("KCAS.mean.30s") && !out.contains("AoA.mean.30s"), out.toString());
        assertEquals(NAMES.size() - 2 + 5, m.outputCount(), out.toString());
        double[] in = new double[NAMES.size()];
        for (int i = 0; i < in.length; i++) {
            in[i] = i + 0.5;
        }
        in[at(NAMES, "KCAS.mean.30s")] = 200.0;
        in[at(NAMES, "KCAS.mean.1s")] = 180.0;
        in[at(NAMES, "KCAS.min.1s")] = 170.0;
        in[at(NAMES, "KCAS.max.1s")] = 190.0;
        in[at(NAMES, "KCAS.slope.1s")] = -2.0;
        in[at(NAMES, "AoA.mean.30s")] = 4.0;
        in[at(NAMES, "AoA.max.1s")] = 15.0;
        in[at(NAMES, "AoA.min.1s")] = 11.0;
        in[at(NAMES, "Q.max.1s")] = 6.0;
        in[at(NAMES, "Q.min.1s")] = -9.0;
        double[] o = new double[m.outputCount()];
        m.apply(in, o);
        assertEquals(-0.1, o[at(out, "KCAS.mean.1s-base/base")], 1e-15);
        assertEquals(-0.01, o[at(out, "KCAS.slope.1s/base")], 1e-15);
        assertEquals(0.1, o[at(out, "KCAS.range.1s/base")], 1e-15);
        assertEquals(11.0, o[at(out, "AoA.max.1s-base")], 0.0);
        assertEquals(in[at(NAMES, "AoA.std.1s")], o[at(out, "AoA.std.1s")], 0.0);
        assertEquals(4.0, o[at(out, "AoA.range.1s")], 0.0);
        assertEquals(6.0, o[at(out, "Q.max.1s")], 0.0);
        assertEquals(15.0, o[at(out, "Q.range.1s")], 0.0);
        // a missing baseline makes its dependants missing too; the prep that follows imputes them
        in[at(NAMES, "AoA.mean.30s")] = Double.NaN;
        m.apply(in, o);
        assertTrue(Double.isNaN(o[at(out, "AoA.max.1s-base")]));
        assertEquals(4.0, o[at(out, "AoA.range.1s")], 0.0);
    }

    @Test
    void namesOfAnotherShapePassUnchanged() {
        FeatureMap m = FeatureMap.relative(List.of("altitude", "KCAS.mean", "Q.mean.1s"));
        assertEquals(List.of("altitude", "KCAS.mean", "Q.mean.1s"), m.outputNames());
        double[] o = new double[3];
        m.apply(new double[] {1, 2, 3}, o);
        assertArrayEquals(new double[] {1, 2, 3}, o, 0.0);
    }

    @Test
    void aClassifierWithRelativeFeaturesReadsTheExtractorsRowsAndAnswersAsItsMappedModel() {
        LabelledRows rows = SyntheticRows.make(4, 120, 3);
        TrainerSettings s = TrainerSettings.defaults().withFeatures(FeatureForm.RELATIVE)
                .withForest(TrainerSettings.defaults().forest().withTrees(10));
        Classifier c = new Trainer(s).fit(rows);
        assertEquals(rows.featureNames(), c.featureNames());
        assertEquals(FeatureMap.relative(rows.featureNames()).outputNames(), c.modelFeatureNames());
        // the same forest fitted on rows mapped beforehand predicts the same: the map is applied, once
        LabelledRows mapped = FeatureMap.relative(rows.featureNames()).apply(rows);
        Classifier plain = new Trainer(s.withFeatures(FeatureForm.RAW)).fit(mapped);
        double[] p = new double[c.classCount()];
        double[] q = new double[c.classCount()];
        for (int i = 0; i < rows.rows(); i += 7) {
            c.predict(rows.row(i), p);
            plain.predict(mapped.row(i), q);
            assertArrayEquals(q, p, 1e-12);
        }
    }

    @Test
    void theConfigNamesTheFeatureForm() {
        assertEquals(FeatureForm.RAW, TrainerSettings.defaults().features());
        assertEquals(FeatureForm.RELATIVE, TrainerSettings.parse("features: relative\n", "f.yaml").features());
        InputRejectedException e = assertThrows(InputRejectedException.class,
                () -> TrainerSettings.parse("features: scaled\n", "f.yaml"));
        assertEquals("f.yaml:1:11: unknown features 'scaled'; expected one of: raw, relative",
                e.problems().get(0).toString());
    }
}
