package org.pointcall.models.rank;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.awt.image.BufferedImage;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.List;

import javax.imageio.ImageIO;

import org.apache.commons.math3.stat.correlation.PearsonsCorrelation;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.pointcall.models.data.LabelledRows;
import org.pointcall.models.data.SortieInfo;
import org.pointcall.models.train.BalanceSettings;
import org.pointcall.models.train.SyntheticRows;
import org.pointcall.models.train.TrainerSettings;

class FeatureRankingTest {
    static LabelledRows rows;
    static FeatureRanking ranking;

    @BeforeAll
    static void data() {
        rows = SyntheticRows.make(6, 300, 21);
        TrainerSettings d = TrainerSettings.defaults();
        ranking = FeatureRanking.withForestImportance(rows, d.withBalance(BalanceSettings.undersample(3))
                .withForest(d.forest().withTrees(30)));
    }

    @Test
    void pointBiserialIsPearsonsRWithTheClassIndicator() {
        double[][] r = FeatureRanking.pointBiserial(rows);
        PearsonsCorrelation reference = new PearsonsCorrelation();
        for (int f = 0; f < rows.featureCount(); f++) {
            double[] x = new double[rows.rows()];
            for (int i = 0; i < x.length; i++) {
                x[i] = rows.value(i, f);
            }
            for (int c = 0; c < SyntheticRows.CLASSES; c++) {
                double[] indicator = new double[rows.rows()];
                for (int i = 0; i < indicator.length; i++) {
                    indicator[i] = rows.classOf(i) == c ? 1 : 0;
                }
                if (f == SyntheticRows.CONSTANT_FEATURE) {
                    assertTrue(Double.isNaN(r[f][c]), "constant feature: r undefined");
                    continue;
                }
                // reference: Apache Commons Math 3.6.1 PearsonsCorrelation; both are double-precision sums over
                // 1800 rows, so they agree to about 1e-13 (feature 6 sits near 1000, which tests the centring)
                assertEquals(reference.correlation(x, indicator), r[f][c], 1e-12, "feature " + f + " class " + c);
            }
        }
        // a class with no rows: indicator constant, r undefined
        assertTrue(Double.isNaN(r[0][LabelledRows.classCount() - 1]));
    }

    @Test
    void missingValuesAreLeftOutOfThatFeaturesCorrelationOnly() {
        List<SortieInfo> s = List.of(new SortieInfo("s", "", "", ""));
        LabelledRows.Builder b = LabelledRows.builder(List.of("a", "b"), s);
        java.util.SplittableRandom rnd = new java.util.SplittableRandom(4);
        double[] xa = new double[400];
        double[] xb = new double[400];
        int[] cls = new int[400];
        for (int i = 0; i < 400; i++) {
            cls[i] = rnd.nextInt(3);
            xa[i] = rnd.nextGaussian() + cls[i];
            xb[i] = i % 5 == 0 ? Double.NaN : rnd.nextGaussian() - cls[i];
            b.add(new double[] {xa[i], xb[i]}, cls[i], i, 0, false);
        }
        double[][] r = FeatureRanking.pointBiserial(b.build());
        PearsonsCorrelation reference = new PearsonsCorrelation();
        double[] finiteB = Arrays.stream(xb).filter(Double::isFinite).toArray();
        for (int c = 0; c < 3; c++) {
            final int cc = c;
            double[] ia = Arrays.stream(cls).mapToDouble(k -> k == cc ? 1 : 0).toArray();
            double[] ib = new double[finiteB.length];
            int m = 0;
            for (int i = 0; i < 400; i++) {
                if (Double.isFinite(xb[i])) {
                    ib[m++] = cls[i] == c ? 1 : 0;
                }
            }
            // reference: Apache Commons Math 3.6.1 PearsonsCorrelation, on the rows where the feature is finite
            assertEquals(reference.correlation(xa, ia), r[0][c], 1e-12);
            assertEquals(reference.correlation(finiteB, ib), r[1][c], 1e-12);
        }
    }

    @Test
    void informativeFeaturesRankAboveNoiseAndImportanceSharesSumToOne() {
        List<String> f = ranking.features();
        assertEquals(rows.featureCount(), f.size());
        double total = 0;
        for (int i = 0; i < f.size(); i++) {
            total += ranking.importance(i);
            if (i > 0) {
                assertTrue(ranking.importance(i) <= ranking.importance(i - 1), "ranking order");
            }
        }
        assertEquals(1.0, total, 1e-9);
        int noise = f.indexOf(SyntheticRows.FEATURES.get(SyntheticRows.NOISE_FEATURE));
        for (int inf = 0; inf < SyntheticRows.CLASSES; inf++) {
            assertTrue(f.indexOf(SyntheticRows.FEATURES.get(inf)) < noise, "feature " + inf + " above noise");
        }
        assertEquals(List.of("none", "stall-level", "stall-turn", "loop", "wind-up-turn", "level-accel"),
                ranking.classes());
        // the feature carrying class c correlates most with c's indicator
        for (int c = 1; c < SyntheticRows.CLASSES; c++) {
            int row = f.indexOf(SyntheticRows.FEATURES.get(c));
            for (int j = 0; j < ranking.classes().size(); j++) {
                if (j != c) {
                    assertTrue(ranking.correlation(row, c) > ranking.correlation(row, j));
                }
            }
        }
    }

    @Test
    void csvAndMarkdownHoldEveryFeatureAndReadBack(@TempDir Path dir) throws Exception {
        Path csv = dir.resolve("ranking.csv");
        ranking.writeCsv(csv);
        List<String> lines = Files.readAllLines(csv);
        assertEquals("feature,importance,r_none,r_stall-level,r_stall-turn,r_loop,r_wind-up-turn,r_level-accel",
                lines.get(0));
        assertEquals(rows.featureCount() + 1, lines.size());
        for (int i = 0; i < rows.featureCount(); i++) {
            String[] cells = lines.get(i + 1).split(",", -1);
            assertEquals(ranking.features().get(i), cells[0]);
            assertEquals(ranking.importance(i), Double.parseDouble(cells[1]));
            for (int j = 0; j < ranking.classes().size(); j++) {
                double r = ranking.correlation(i, j);
                assertEquals(Double.isNaN(r) ? "" : Double.toString(r), cells[2 + j]);
            }
        }
        Path md = dir.resolve("ranking.md");
        ranking.writeMarkdown(md);
        List<String> m = Files.readAllLines(md);
        assertEquals(rows.featureCount() + 2, m.size());
        assertTrue(m.get(0).startsWith("| feature | forest importance | r none |"));
    }

    @Test
    void theHeatMapIsAPngWithACellPerFeatureAndClass(@TempDir Path dir) throws Exception {
        Path png = dir.resolve("ranking.png");
        HeatMap.writePng(ranking, "Feature ranking, synthetic rows", png);
        BufferedImage img = ImageIO.read(png.toFile());
        assertTrue(img.getWidth() > 600 && img.getHeight() > rows.featureCount() * 20, img.getWidth() + "x"
                + img.getHeight());
        // the strongest correlation's colour is painted (cells are filled with exactly their colour)
        double strongest = 0;
        for (int i = 0; i < ranking.features().size(); i++) {
            for (int j = 0; j < ranking.classes().size(); j++) {
                double r = ranking.correlation(i, j);
                if (!Double.isNaN(r) && Math.abs(r) > Math.abs(strongest)) {
                    strongest = r;
                }
            }
        }
        int want = HeatMap.colour(strongest).getRGB();
        int found = 0;
        for (int y = 0; y < img.getHeight(); y++) {
            for (int x = 0; x < img.getWidth(); x++) {
                if (img.getRGB(x, y) == want) {
                    found++;
                }
            }
        }
        assertTrue(found > 100, "pixels of the strongest cell's colour: " + found);
        assertEquals(new java.awt.Color(247, 247, 247), HeatMap.colour(0));
        assertEquals(new java.awt.Color(178, 24, 43), HeatMap.colour(1));
        assertEquals(new java.awt.Color(33, 102, 172), HeatMap.colour(-1));
    }
}
