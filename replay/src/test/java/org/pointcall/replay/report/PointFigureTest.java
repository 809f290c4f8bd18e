package org.pointcall.replay.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.awt.Color;
import java.awt.image.BufferedImage;
import java.io.ByteArrayInputStream;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;

import javax.imageio.ImageIO;

import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.pointcall.ingest.file.CsvWriter;
import org.pointcall.ingest.sim.SortieSimulator;
import org.pointcall.ingest.sim.airframe.Airframes;
import org.pointcall.ingest.sim.pilot.PilotSettings;
import org.pointcall.ingest.sim.sensor.SensorSettings;
import org.pointcall.ingest.sim.truth.PointTruth;
import org.pointcall.ingest.sim.truth.SortieTruth;
import org.pointcall.shared.card.CardFiles;
import org.pointcall.shared.card.TestCard;
import org.pointcall.shared.card.TestPoint;
import org.pointcall.shared.demo.DemoFiles;
import org.pointcall.shared.dictionary.ParameterDictionary;
import org.pointcall.shared.kind.ManoeuvreKind;
import org.pointcall.shared.outcome.BandResult;
import org.pointcall.shared.outcome.BandStatus;
import org.pointcall.shared.outcome.PointOutcome;
import org.pointcall.shared.outcome.Verdict;

/**
 * A stall flown on the simulator, written to CSV and read back through the report's reading; its figure drawn
 * from the simulator's own truth (begin, end, break) with one band marked held and one not.
 */
class PointFigureTest {
    private static final String CARD = String.join("\n",
            "sortie: FIG-1",
            "airframe: veskarn-02",
            "points:",
            "  - id: SL-1",
            "    kind: stall-level",
            "    title: Wings-level stall",
            "    bands:",
            "      - {parameter: Hp, phase: entry, target: 10000, tol: 500, unit: ft}",
            "      - {parameter: Roll, phase: throughout, target: 0, tol: 5, unit: deg}",
            "      - {parameter: KCAS, phase: rate, before: break, over: 10, target: -1.0, tol: 0.25, unit: kt/s}",
            "");

    @TempDir
    static Path dir;
    static ParameterDictionary dict;
    static TestCard card;
    static SortieAnalysis.Reading reading;
    static PointTruth stall;

    @BeforeAll
    static void fly() {
        dict = DemoFiles.dictionary();
        card = CardFiles.parse(CARD, "fig-card.yaml", dict);
        Path csv = dir.resolve("sortie.csv");
        SortieTruth truth;
        try (CsvWriter w = CsvWriter.create(csv, dict)) {
            truth = new SortieSimulator(Airframes.load("veskarn-02"), card, dict, 5, 32, SensorSettings.CLEAN,
                    PilotSettings.NO_FLAWS).run(List.of(w));
        }
        stall = truth.points().get(0);
        reading = SortieAnalysis.observe(csv, dict, card, ReportProgress.NONE);
    }

    private static PointOutcome outcome(boolean hpHeld, boolean rollHeld) {
        Map<String, Long> instants = new LinkedHashMap<>();
        stall.instants().forEach((k, v) -> instants.put(k, Math.round(v * 1e9)));
        List<BandResult> bands = new ArrayList<>();
        bands.add(new BandResult(0, "Hp", "entry", "ft", "10000 +/- 500 ft", 10000.0, 0.5,
                hpHeld ? BandStatus.CLEAR : BandStatus.OUT, hpHeld, 0));
        bands.add(new BandResult(1, "Roll", "throughout", "deg", "0 +/- 5 deg", 1.0, 0.4,
                rollHeld ? BandStatus.CLEAR : BandStatus.OUT, rollHeld, 0));
        return new PointOutcome(1, "SL-1", "stall-level", "Wings-level stall", Math.round(stall.beginS() * 1e9),
                Math.round(stall.endS() * 1e9), 0.9, hpHeld && rollHeld ? Verdict.GOOD : Verdict.REPEAT, List.of(),
                bands, List.of(), instants, List.of(), null);
    }

    private static TestPoint point() {
        return card.point("SL-1").orElseThrow();
    }

    @Test
    void theFigureHasOnePanelPerPlannedParameterAndItsPngDecodesToTheSameSize() throws Exception {
        BufferedImage img = PointFigure.render(outcome(true, false), point(), reading.trace(), List.of(), dict);
        assertNotNull(img);
        int panels = FigurePlan.panels(ManoeuvreKind.STALL_LEVEL, point(), dict).size();
        assertEquals(5, panels); // KCAS, AoA, Nz, Hp, Roll: the bands' parameters are among them
        assertEquals(PointFigure.WIDTH_PX, img.getWidth());
        assertEquals(PointFigure.FRAME_PX + panels * PointFigure.PANEL_PX, img.getHeight());
        BufferedImage back = ImageIO.read(new ByteArrayInputStream(PointFigure.png(img)));
        assertEquals(img.getWidth(), back.getWidth());
        assertEquals(img.getHeight(), back.getHeight());
    }

    @Test
    void theFigureIsNotBlankAndShowsTheLineTheHeldBandAndTheBrokenOne() {
        BufferedImage img = PointFigure.render(outcome(true, false), point(), reading.trace(), List.of(), dict);
        long white = 0;
        long line = 0;
        Set<Integer> colours = new HashSet<>();
        for (int y = 0; y < img.getHeight(); y++) {
            for (int x = 0; x < img.getWidth(); x++) {
                int rgb = img.getRGB(x, y) & 0xFFFFFF;
                colours.add(rgb);
                if (rgb == 0xFFFFFF) {
                    white++;
                }
                if (near(rgb, PointFigure.LINE, 12)) {
                    line++;
                }
            }
        }
        long all = (long) img.getWidth() * img.getHeight();
        assertTrue(white < all * 0.97, "almost all white: " + white + " of " + all);
        assertTrue(line > 2000, "line pixels: " + line);
        assertTrue(colours.size() > 50, "colours: " + colours.size());
        // the fills are the band colours at alpha 50 over white
        assertTrue(count(img, blend(PointFigure.HELD, 50)) > 200, "no held-band fill");
        assertTrue(count(img, blend(PointFigure.NOT_HELD, 50)) > 200, "no broken-band fill");
        BufferedImage allHeld = PointFigure.render(outcome(true, true), point(), reading.trace(), List.of(), dict);
        assertEquals(0, count(allHeld, blend(PointFigure.NOT_HELD, 50)), "a red fill with every band held");
    }

    @Test
    void theTraceKeepsTheStallAndTheQualityCountsTheFrames() {
        SortieTrace t = reading.trace();
        int kcas = t.column("KCAS");
        assertTrue(kcas >= 0);
        int at = t.firstAtOrAfter(Math.round(stall.instants().get("break") * 1e9));
        assertTrue(t.value(kcas, at) > 60 && t.value(kcas, at) < 160, "KCAS at the break " + t.value(kcas, at));
        DataQuality q = reading.quality();
        assertTrue(q.frames() > 1000);
        assertEquals(1 / 32.0, q.frameStepS(), 1e-6); // the simulator's frame rate, clean sensors: no jitter
        assertEquals(0, q.gapCount());
        assertEquals(0, q.wildPointsTotal());
    }

    private static boolean near(int rgb, Color c, int tol) {
        return Math.abs((rgb >> 16 & 0xFF) - c.getRed()) <= tol && Math.abs((rgb >> 8 & 0xFF) - c.getGreen()) <= tol
                && Math.abs((rgb & 0xFF) - c.getBlue()) <= tol;
    }

    private static Color blend(Color c, int alpha) {
        double a = alpha / 255.0;
        return new Color((int) Math.round(c.getRed() * a + 255 * (1 - a)),
                (int) Math.round(c.getGreen() * a + 255 * (1 - a)), (int) Math.round(c.getBlue() * a + 255 * (1 - a)));
    }

    private static long count(BufferedImage img, Color c) {
        long n = 0;
        for (int y = 0; y < img.getHeight(); y++) {
            for (int x = 0; x < img.getWidth(); x++) {
                if (near(img.getRGB(x, y) & 0xFFFFFF, c, 3)) {
                    n++;
                }
            }
        }
        return n;
    }
}
