package org.pointcall.replay.report;

import java.io.IOException;
import java.io.OutputStream;
import java.nio.file.Files;
import java.nio.file.Path;

import org.pointcall.shared.error.PointcallException;

import com.openhtmltopdf.pdfboxout.PdfRendererBuilder;
import com.openhtmltopdf.util.XRLog;

/**
 * Lays the report's XHTML out into a PDF (openhtmltopdf on PDFBox), with the PDF's standard fonts, so nothing is
 * looked up on the machine and the same page gives the same PDF anywhere.
 */
final class ReportPdf {
    static {
        // the layout engine logs every stage at INFO on standard error: a command's output stays its own
        XRLog.setLoggingEnabled(false);
    }

    private ReportPdf() {
    }

    static void write(String xhtml, Path pdf, String title) {
        try (OutputStream out = Files.newOutputStream(pdf)) {
            PdfRendererBuilder b = new PdfRendererBuilder();
            b.useFastMode();
            b.withProducer("pointcall");
            b.withHtmlContent(xhtml, pdf.toAbsolutePath().getParent().toUri().toString());
            b.toStream(out);
            b.run();
        } catch (IOException e) {
            throw new PointcallException("cannot write " + pdf + ": " + e.getMessage(), e);
        }
    }
}
