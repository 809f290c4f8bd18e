package org.pointcall.replay.report;

import java.awt.image.BufferedImage;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

import org.pointcall.replay.report.FrameTimeline.Gap;
import org.pointcall.shared.card.CardFiles;
import org.pointcall.shared.card.TestPoint;
import org.pointcall.shared.error.PointcallException;
import org.pointcall.shared.outcome.PointOutcome;
import org.pointcall.shared.outcome.PointsFile;

/**
 * Writes a sortie's debrief report into a folder: {@code report.html} (self-contained: style and figures inside),
 * {@code report.pdf} laid out from the same page, one PNG per point in {@code figures/}, and the next sortie's
 * card as {@code next-card.yaml} when there is one. Figures are drawn without a screen.
 */
public final class DebriefReport {
    /** File name of the HTML report. */
    public static final String HTML_FILE = "report.html";
    /** File name of the PDF report. */
    public static final String PDF_FILE = "report.pdf";
    /** Folder of the figures. */
    public static final String FIGURES_DIR = "figures";

    static {
        // figures are drawn into images: never ask for a display, even where one is set
        if (System.getProperty("java.awt.headless") == null) {
            System.setProperty("java.awt.headless", "true");
        }
    }

    private DebriefReport() {
    }

    /**
     * What was written.
     *
     * @param html     the HTML report
     * @param pdf      the PDF report, or null when not asked for
     * @param figures  the figure PNGs, in point order
     * @param nextCard the next card file, or null when there is none
     * @param next     the next card, or why there is none
     */
    public record Written(Path html, Path pdf, List<Path> figures, Path nextCard, NextCardResult next) {
        public Written {
            figures = List.copyOf(figures);
        }
    }

    /**
     * Writes the report.
     *
     * @param pdf false to leave the PDF out (the HTML alone)
     * @throws PointcallException when the folder cannot be written
     */
    public static Written write(DebriefContent content, Path outDir, boolean pdf, ReportProgress progress) {
        PointsFile points = content.points();
        NextCardResult next = NextCardResult.of(content.card(), points);
        Map<Long, byte[]> pngs = new LinkedHashMap<>();
        List<Path> figureFiles = new ArrayList<>();
        try {
            Files.createDirectories(outDir);
            Path figDir = outDir.resolve(FIGURES_DIR);
            int n = points.points().size();
            List<Gap> gaps = content.quality() == null ? List.of() : content.quality().gaps();
            for (int i = 0; i < n && content.trace() != null; i++) {
                PointOutcome o = points.points().get(i);
                progress.progress(pdf ? 0.7 * i / n : (double) i / n, "figure " + (i + 1) + " of " + n + ": "
                        + (o.cardId() == null ? o.kind() : o.cardId()));
                TestPoint tp = o.cardId() == null || content.card() == null ? null
                        : content.card().point(o.cardId()).orElse(null);
                BufferedImage img = PointFigure.render(o, tp, content.trace(), gaps, content.dictionary());
                if (img == null) {
                    continue;
                }
                byte[] png = PointFigure.png(img);
                pngs.put(o.detection(), png);
                Files.createDirectories(figDir);
                Path file = figDir.resolve(String.format("%02d-%s.png", i + 1,
                        o.cardId() == null ? o.kind() : safe(o.cardId())));
                Files.write(file, png);
                figureFiles.add(file);
            }
            String page = ReportPage.xhtml(content, next, pngs);
            Path html = outDir.resolve(HTML_FILE);
            Files.writeString(html, page, StandardCharsets.UTF_8);
            Path nextFile = null;
            if (next.card() != null) {
                String yaml = CardFiles.toYaml(next.card());
                CardFiles.parse(yaml, NextCardResult.FILE, content.dictionary()); // never write what cannot be read
                nextFile = outDir.resolve(NextCardResult.FILE);
                Files.writeString(nextFile, yaml, StandardCharsets.UTF_8);
            }
            Path pdfFile = null;
            if (pdf) {
                progress.progress(0.7, "laying out the PDF");
                pdfFile = outDir.resolve(PDF_FILE);
                ReportPdf.write(page, pdfFile, "Debrief " + points.sortie());
            }
            progress.progress(1, "report written");
            return new Written(html, pdfFile, figureFiles, nextFile, next);
        } catch (IOException e) {
            throw new PointcallException("cannot write the report in " + outDir + ": " + e.getMessage(), e);
        }
    }

    /** A card id as a file name part: letters, digits, dot, dash and underscore kept, the rest as '_'. */
    static String safe(String id) {
        return id.replaceAll("[^A-Za-z0-9._-]", "_");
    }
}
