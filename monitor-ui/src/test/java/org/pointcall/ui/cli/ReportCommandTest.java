package org.pointcall.ui.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.File;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

import javax.xml.parsers.DocumentBuilderFactory;

import org.apache.pdfbox.Loader;
import org.apache.pdfbox.pdmodel.PDDocument;
import org.apache.pdfbox.text.PDFTextStripper;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.pointcall.shared.outcome.MetricValue;
import org.pointcall.shared.outcome.PointOutcome;
import org.pointcall.shared.outcome.PointsFile;
import org.pointcall.shared.outcome.PointsFiles;
import org.w3c.dom.Document;
import org.w3c.dom.Element;
import org.w3c.dom.NodeList;

/**
 * report on a short simulated sortie (a stall and a loop), against analyze on the same recording and card: the
 * report must hold every card point, and the same verdicts and metrics to the last digit.
 */
class ReportCommandTest {
    private static final String CARD = String.join("\n",
            "sortie: R-3",
            "airframe: veskarn-02",
            "limits:",
            "  - {parameter: Nz, max: 6.0, unit: g}",
            "points:",
            "  - id: SL-1",
            "    kind: stall-level",
            "    title: Wings-level stall, clean, idle, 1 kt/s entry",
            "    bands:",
            "      - {parameter: Hp, phase: entry, target: 10000, tol: 500, unit: ft}",
            "      - {parameter: Roll, phase: throughout, target: 0, tol: 5, unit: deg}",
            "      - {parameter: KCAS, phase: rate, before: break, over: 10, target: -1.0, tol: 0.25, unit: kt/s}",
            "      - {metric: stall-kcas, phase: result, min: 106, max: 120, unit: kt}",
            "  - id: LP-1",
            "    kind: loop",
            "    title: Loop from 320 KCAS, 4 g pull",
            "    bands:",
            "      - {parameter: KCAS, phase: entry, target: 320, tol: 10, unit: kt}",
            "      - {parameter: Hp, phase: entry, target: 8000, tol: 300, unit: ft}",
            "  - id: SL-9",
            "    kind: stall-level",
            "    title: A stall the simulated pilot is not asked to fly",
            "    bands:",
            "      - {parameter: Hp, phase: entry, target: 30000, tol: 500, unit: ft}",
            "");

    @TempDir
    static Path dir;
    static Path card;
    static Path sortie;
    static PointsFile analysed;
    static CommandRun report;

    @BeforeAll
    static void flyAnalyseAndReport() throws Exception {
        card = dir.resolve("card.yaml");
        Files.writeString(card, CARD, StandardCharsets.UTF_8);
        Path flown = dir.resolve("flown.yaml");
        // the pilot flies the first two points only: the third must come out "not flown"
        Files.writeString(flown, CARD.substring(0, CARD.indexOf("  - id: SL-9")), StandardCharsets.UTF_8);
        Path sim = dir.resolve("sim");
        CommandRun s = CommandRun.of("simulate", "--card", flown.toString(), "--seed", "3", "--out", sim.toString());
        assertEquals(0, s.exitCode(), s.err());
        sortie = sim.resolve("sortie.csv");
        CommandRun a = CommandRun.of("analyze", "--input", sortie.toString(), "--card", card.toString(), "--out",
                dir.resolve("analysis").toString());
        assertEquals(0, a.exitCode(), a.err());
        analysed = PointsFiles.read(dir.resolve("analysis/points.json"));
        report = CommandRun.of("report", "--input", sortie.toString(), "--card", card.toString(), "--out",
                dir.resolve("report").toString());
        assertEquals(0, report.exitCode(), report.err());
    }

    private static Document html(Path file) throws Exception {
        DocumentBuilderFactory f = DocumentBuilderFactory.newInstance();
        f.setNamespaceAware(false);
        return f.newDocumentBuilder().parse(file.toFile()); // XHTML: it must parse as XML
    }

    private static List<Element> rows(Document d, String attribute) {
        return elements(d, "tr", attribute);
    }

    private static List<Element> elements(Document d, String tag, String attribute) {
        NodeList all = d.getElementsByTagName(tag);
        List<Element> out = new java.util.ArrayList<>();
        for (int i = 0; i < all.getLength(); i++) {
            Element e = (Element) all.item(i);
            if (e.hasAttribute(attribute)) {
                out.add(e);
            }
        }
        return out;
    }

    @Test
    void theReportHoldsEveryCardPointAndAnalyzesVerdictsAndMetricsExactly() throws Exception {
        Document d = html(dir.resolve("report/report.html"));
        Map<String, String> verdictByDetection = new LinkedHashMap<>();
        Map<String, String> verdictByCardId = new HashMap<>();
        for (Element r : rows(d, "data-verdict")) {
            if (r.hasAttribute("data-detection")) {
                verdictByDetection.put(r.getAttribute("data-detection"), r.getAttribute("data-verdict"));
            }
            if (r.hasAttribute("data-card-id")) {
                verdictByCardId.putIfAbsent(r.getAttribute("data-card-id"), r.getAttribute("data-verdict"));
            }
        }
        for (String id : List.of("SL-1", "LP-1", "SL-9")) {
            assertTrue(verdictByCardId.containsKey(id), id + " missing from the point table");
        }
        assertEquals("not-flown", verdictByCardId.get("SL-9"));
        assertEquals(analysed.points().size(), verdictByDetection.size());
        Map<String, String> metrics = new HashMap<>();
        for (Element r : elements(d, "*", "data-metric")) { // a kind's metrics in rows, extra ones in a line
            metrics.put(r.getAttribute("data-point") + "/" + r.getAttribute("data-metric"),
                    r.getAttribute("data-value") + " " + r.getAttribute("data-unit"));
        }
        int compared = 0;
        for (PointOutcome p : analysed.points()) {
            String key = Long.toString(p.detection());
            assertEquals(p.verdict() == null ? "none" : p.verdict().key(), verdictByDetection.get(key),
                    "verdict of detection " + key);
            for (MetricValue m : p.metrics()) {
                assertEquals(m.value() + " " + m.unit(), metrics.get(key + "/" + m.name()), m.name());
                compared++;
            }
        }
        assertTrue(compared >= 5, "metrics compared: " + compared);
        assertEquals(metrics.size(), compared, "the report has metrics analyze has not");
        // the report's own points file is analyze's, but for nothing
        assertEquals(PointsFiles.toJson(analysed), PointsFiles.toJson(PointsFiles.read(
                dir.resolve("report/points.json"))));
    }

    @Test
    void thePdfOpensAndNamesEveryPointAndTheCaution() throws Exception {
        File pdf = dir.resolve("report/report.pdf").toFile();
        try (PDDocument doc = Loader.loadPDF(pdf)) {
            assertTrue(doc.getNumberOfPages() > 0);
            String text = new PDFTextStripper().getText(doc).replaceAll("\\s+", " ");
            for (String id : List.of("SL-1", "LP-1", "SL-9")) {
                assertTrue(text.contains(id), id + " not in the PDF text");
            }
            assertTrue(text.contains("does not replace the test conductor"), "caution missing");
            assertTrue(text.contains("Data quality"));
        }
    }

    @Test
    void everyFlownPointHasAFigureAndTheHtmlCarriesItInside() throws Exception {
        long flown = analysed.points().size();
        try (var files = Files.list(dir.resolve("report/figures"))) {
            assertEquals(flown, files.filter(p -> p.toString().endsWith(".png")).count());
        }
        String html = Files.readString(dir.resolve("report/report.html"));
        assertEquals(flown, html.split("src=\"data:image/png;base64,", -1).length - 1);
        assertFalse(html.contains("src=\"http"), "a self-contained report links nothing outside");
        assertTrue(Files.isRegularFile(dir.resolve("report/next-card.yaml")), report.out());
    }

    @Test
    void fromAnAnalyzeFolderTheVerdictsAreTheSameAndTheRecordingOnlyAddsFigures() throws Exception {
        Path out = dir.resolve("from-results");
        CommandRun r = CommandRun.of("report", "--results", dir.resolve("analysis").toString(), "--input",
                sortie.toString(), "--card", card.toString(), "--out", out.toString(), "--no-pdf");
        assertEquals(0, r.exitCode(), r.err());
        assertFalse(Files.exists(out.resolve("report.pdf")));
        Document d = html(out.resolve("report.html"));
        int n = 0;
        for (Element row : rows(d, "data-detection")) {
            if (!row.hasAttribute("data-verdict")) {
                continue;
            }
            PointOutcome p = analysed.points().stream().filter(o -> Long.toString(o.detection())
                    .equals(row.getAttribute("data-detection"))).findFirst().orElseThrow();
            assertEquals(p.verdict() == null ? "none" : p.verdict().key(), row.getAttribute("data-verdict"));
            n++;
        }
        assertEquals(analysed.points().size(), n);
        Path bare = dir.resolve("bare");
        CommandRun b = CommandRun.of("report", "--results", dir.resolve("analysis").toString(), "--out",
                bare.toString(), "--no-pdf");
        assertEquals(0, b.exitCode(), b.err());
        String html = Files.readString(bare.resolve("report.html"));
        assertFalse(html.contains("data:image/png"));
        assertTrue(html.contains("The recording was not read for this report"));
    }

    @Test
    void badInputIsOneLineAndExitTwo() throws Exception {
        Path missing = dir.resolve("nothing.csv");
        CommandRun r = CommandRun.of("report", "--input", missing.toString(), "--out", dir.resolve("x").toString());
        assertEquals(2, r.exitCode());
        assertEquals(1, r.err().strip().lines().count(), r.err());
        assertTrue(r.err().contains(missing.toString()) && r.err().contains("no such recording"), r.err());

        Path broken = dir.resolve("broken");
        Files.createDirectories(broken);
        Files.writeString(broken.resolve("points.json"), "{\"format\": \"pointcall-points/1\", \"points\": [",
                StandardCharsets.UTF_8);
        CommandRun b = CommandRun.of("report", "--results", broken.toString(), "--out", dir.resolve("y").toString());
        assertEquals(2, b.exitCode());
        assertEquals(1, b.err().strip().lines().count(), b.err());
        assertTrue(b.err().contains(broken.resolve("points.json").toString())
                && b.err().contains("not a readable points file"), b.err());

        CommandRun none = CommandRun.of("report", "--out", dir.resolve("z").toString());
        assertEquals(2, none.exitCode());
        assertTrue(none.err().contains("--input FILE") && none.err().contains("--results DIR"), none.err());
    }
}
