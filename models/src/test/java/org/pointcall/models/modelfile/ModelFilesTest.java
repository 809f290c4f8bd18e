package org.pointcall.models.modelfile;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.net.URL;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Properties;
import java.util.SplittableRandom;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.pointcall.shared.error.InputRejectedException;
import org.pointcall.shared.error.PointcallException;

import com.fasterxml.jackson.databind.node.ObjectNode;

import smile.classification.LogisticRegression;
import smile.classification.RandomForest;
import smile.data.DataFrame;
import smile.data.Tuple;
import smile.data.formula.Formula;
import smile.data.type.StructType;
import smile.data.vector.IntVector;

class ModelFilesTest {
    private static final Instant CREATED = Instant.parse("2031-04-02T09:30:00Z");

    /** Three separable classes over the 12 features of {@link TestModels#WINDOWS}. */
    private static double[][] features(int n, long seed, int[] labels) {
        SplittableRandom r = new SplittableRandom(seed);
        double[][] x = new double[n][12];
        for (int i = 0; i < n; i++) {
            int c = r.nextInt(3);
            labels[i] = c;
            for (int f = 0; f < 12; f++) {
                x[i][f] = r.nextGaussian() + (f % 3 == c ? 2.5 : 0);
            }
        }
        return x;
    }

    private static RandomForest forest() {
        int[] y = new int[600];
        double[][] x = features(600, 1, y);
        String[] names = TestModels.description().features().toArray(new String[0]);
        DataFrame df = DataFrame.of(x, names).merge(IntVector.of("class", y));
        Properties p = new Properties();
        p.setProperty("smile.random.forest.trees", "10");
        p.setProperty("smile.random.forest.max.depth", "8");
        return RandomForest.fit(Formula.lhs("class"), df, p);
    }

    private static Path goodFile(Path dir) {
        Path file = dir.resolve("detector.model");
        ModelFiles.write(file, TestModels.description(), forest(), CREATED);
        return file;
    }

    @Test
    void aRandomForestPredictsTheSameAfterSaveAndLoad(@TempDir Path dir) {
        RandomForest rf = forest();
        Path file = dir.resolve("rf.model");
        ModelMetadata written = ModelFiles.write(file, TestModels.description(), rf, CREATED);
        LoadedModel<RandomForest> loaded = ModelFiles.load(file, RandomForest.class);

        assertEquals(written, loaded.metadata());
        assertEquals(TestModels.description(), loaded.metadata().description());
        assertEquals(CREATED, loaded.metadata().created());
        assertEquals("smile.classification.RandomForest", loaded.metadata().payloadClass());
        assertEquals("3.1.1", loaded.metadata().libraries().get("smile"), "the Smile on the class path");
        assertEquals(Runtime.version().toString(), loaded.metadata().libraries().get("java"));

        int[] y = new int[500];
        double[][] test = features(500, 2, y);
        StructType before = rf.schema();
        StructType after = loaded.model().schema();
        double[] pa = new double[3];
        double[] pb = new double[3];
        int agree = 0;
        for (int i = 0; i < test.length; i++) {
            int a = rf.predict(Tuple.of(test[i], before), pa);
            int b = loaded.model().predict(Tuple.of(test[i], after), pb);
            assertEquals(a, b);
            assertArrayEquals(pa, pb, 0.0, "posteriors identical to the bit");
            agree += a == y[i] ? 1 : 0;
        }
        assertTrue(agree > 400, "the forest learnt something: " + agree + " of 500");
        assertEquals(written, ModelFiles.readMetadata(file));
    }

    @Test
    void aLogisticRegressionPredictsTheSameAfterSaveAndLoad(@TempDir Path dir) {
        int[] y = new int[400];
        double[][] x = features(400, 3, y);
        LogisticRegression lr = LogisticRegression.fit(x, y);
        Path file = dir.resolve("lr.model");
        ModelFiles.write(file, TestModels.description(), lr, CREATED);
        LogisticRegression back = ModelFiles.load(file, LogisticRegression.class).model();
        double[] pa = new double[3];
        double[] pb = new double[3];
        for (double[] row : features(300, 4, new int[300])) {
            assertEquals(lr.predict(row, pa), back.predict(row, pb));
            assertArrayEquals(pa, pb, 0.0);
        }
    }

    @Test
    void aFileHoldingAClassOutsideTheAllowListIsRefusedAndNothingIsDeserialised(@TempDir Path dir)
            throws Exception {
        Path good = goodFile(dir);
        TestModels.EvilMap evil = new TestModels.EvilMap();
        evil.put("k", "v");
        Path crafted = TestModels.withPayload(good, TestModels.serialise(evil),
                "smile.classification.RandomForest", dir.resolve("crafted.model"));
        TestModels.EVIL_RAN.set(false);
        InputRejectedException e = assertThrows(InputRejectedException.class, () -> ModelFiles.load(crafted));
        assertEquals(crafted + ": the payload holds class org.pointcall.models.modelfile.TestModels$EvilMap, which "
                + "a model file may not hold (allowed: Smile's classes (smile.*), pointcall's classifiers "
                + "(org.pointcall.models.train.*), basic java.lang and java.util value and collection types, "
                + "primitives and arrays of these); refused, nothing loaded", e.getMessage());
        assertFalse(TestModels.EVIL_RAN.get(), "the disallowed class's readObject never ran");
        // the metadata alone can still be shown, without deserialising anything
        assertEquals("smile.classification.RandomForest", ModelFiles.readMetadata(crafted).payloadClass());
        assertFalse(TestModels.EVIL_RAN.get());
        // a typed load refuses on the declared class before reading the payload at all
        Path declared = TestModels.withPayload(good, TestModels.serialise(evil), TestModels.EvilMap.class.getName(),
                dir.resolve("declared.model"));
        InputRejectedException d = assertThrows(InputRejectedException.class,
                () -> ModelFiles.load(declared, RandomForest.class));
        assertTrue(d.getMessage().endsWith("the payload is a org.pointcall.models.modelfile.TestModels$EvilMap, "
                + "which a model file may not hold"), d.getMessage());
        assertFalse(TestModels.EVIL_RAN.get());
    }

    @Test
    void aDisallowedClassInsideAllowedCollectionsIsRefused(@TempDir Path dir) throws Exception {
        // the shape of a well-known gadget: a HashMap keyed by a URL, whose hashCode resolves the host
        HashMap<URL, String> map = new HashMap<>();
        map.put(new URL("http://127.0.0.1/"), "x");
        Path crafted = TestModels.withPayload(goodFile(dir), TestModels.serialise(map), "java.util.HashMap",
                dir.resolve("url.model"));
        InputRejectedException e = assertThrows(InputRejectedException.class, () -> ModelFiles.load(crafted));
        assertTrue(e.getMessage().contains("holds class java.net.URL, which a model file may not hold"),
                e.getMessage());
    }

    @Test
    void nestingDeeperThanTheLimitIsRefused(@TempDir Path dir) throws Exception {
        ArrayList<Object> root = new ArrayList<>();
        ArrayList<Object> at = root;
        for (int i = 0; i < 600; i++) {
            ArrayList<Object> next = new ArrayList<>();
            at.add(next);
            at = next;
        }
        Path crafted = TestModels.withPayload(goodFile(dir), TestModels.serialiseDeep(root), "java.util.ArrayList",
                dir.resolve("deep.model"));
        InputRejectedException e = assertThrows(InputRejectedException.class, () -> ModelFiles.load(crafted));
        assertTrue(e.getMessage().contains("deep, more than the 500 allowed"), e.getMessage());
    }

    @Test
    void aCorruptedPayloadIsRefusedNamingTheFile(@TempDir Path dir) throws IOException {
        Path file = goodFile(dir);
        byte[] bytes = Files.readAllBytes(file);
        bytes[bytes.length - 100] ^= 0x01;
        Path bad = Files.write(dir.resolve("bitflip.model"), bytes);
        InputRejectedException e = assertThrows(InputRejectedException.class, () -> ModelFiles.load(bad));
        assertEquals(bad + ": the payload's SHA-256 does not match the metadata (the file is corrupted or was "
                + "altered); refused, nothing loaded", e.getMessage());
    }

    @Test
    void damagedFilesAreRefusedWithOneLineEach(@TempDir Path dir) throws IOException {
        Path file = goodFile(dir);
        byte[] good = Files.readAllBytes(file);

        assertRefused(dir.resolve("absent.model"), "no such model file");
        Path notModel = Files.writeString(dir.resolve("labels.csv"), "kind,begin,end\n");
        assertRefused(notModel, "not a pointcall model file (it does not start with 'pointcall-model')");

        byte[] newer = good.clone();
        newer[17] = 2;
        assertRefused(Files.write(dir.resolve("v2.model"), newer),
                "model file format version 2 is newer than this build reads (1); use a newer pointcall");

        assertRefused(Files.write(dir.resolve("cut.model"), java.util.Arrays.copyOf(good, good.length - 10)),
                "truncated: the payload has");
        assertRefused(Files.write(dir.resolve("head.model"), java.util.Arrays.copyOf(good, 20)),
                "truncated: the file ends inside its header");

        byte[] longer = java.util.Arrays.copyOf(good, good.length + 3);
        assertRefused(Files.write(dir.resolve("tail.model"), longer), "3 bytes follow the payload");
    }

    @Test
    void badMetadataIsRefusedNamingTheField(@TempDir Path dir) throws IOException {
        Path good = goodFile(dir);
        ObjectNode noRate = TestModels.metadata(good);
        ((ObjectNode) noRate.get("decision")).remove("rateHz");
        assertRefused(TestModels.withMetadata(good, noRate, dir.resolve("a.model")),
                "metadata: decision.rateHz is missing");

        ObjectNode unit = TestModels.metadata(good);
        ((ObjectNode) unit.get("parameters").get(1)).put("unit", "furlong");
        assertRefused(TestModels.withMetadata(good, unit, dir.resolve("b.model")),
                "metadata: parameters[1].unit: unknown unit 'furlong'");

        ObjectNode features = TestModels.metadata(good);
        ((com.fasterxml.jackson.databind.node.ArrayNode) features.get("features")).remove(0);
        assertRefused(TestModels.withMetadata(good, features, dir.resolve("c.model")),
                "metadata: feature list (11) is not the one the windows give (12");

        ObjectNode window = TestModels.metadata(good);
        ((ObjectNode) window.get("windows").get(0)).put("parameter", "Nz");
        assertRefused(TestModels.withMetadata(good, window, dir.resolve("d.model")),
                "metadata: window on Nz reads a parameter the model does not list");
    }

    private static void assertRefused(Path file, String messageStart) {
        InputRejectedException e = assertThrows(InputRejectedException.class, () -> ModelFiles.load(file));
        assertTrue(e.getMessage().startsWith(file + ": " + messageStart), e.getMessage());
        assertEquals(1, e.problems().size());
    }

    @Test
    void aModelThatCouldNotBeLoadedBackIsNotWritten(@TempDir Path dir) {
        ArrayList<Object> holder = new ArrayList<>(List.of(new TestModels.EvilMap()));
        Path file = dir.resolve("never.model");
        PointcallException e = assertThrows(PointcallException.class,
                () -> ModelFiles.write(file, TestModels.description(), holder, CREATED));
        assertTrue(e.getMessage().startsWith("cannot write " + file + ": the payload holds class "
                + "org.pointcall.models.modelfile.TestModels$EvilMap"), e.getMessage());
        assertFalse(Files.exists(file));
        try (var files = Files.list(dir)) {
            assertEquals(0, files.count(), "no temporary file left behind");
        } catch (IOException x) {
            throw new AssertionError(x);
        }
    }
}
