package org.pointcall.ui.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.io.PrintWriter;
import java.io.StringWriter;

import org.junit.jupiter.api.Test;

class ProgressBarTest {
    @Test
    void onATerminalOneLineIsRewrittenInPlace() {
        StringWriter s = new StringWriter();
        ProgressBar bar = new ProgressBar(new PrintWriter(s), true);
        bar.progress(0.5, "cv: fold 2 of 4: fitting forest");
        bar.progress(1.0, "done");
        String out = s.toString();
        assertEquals(1, out.chars().filter(c -> c == '\n').count(), "a single line, ended once at 100 %");
        assertEquals(2, out.chars().filter(c -> c == '\r').count());
        String last = out.substring(out.lastIndexOf('\r') + 1);
        assertEquals("[" + "#".repeat(30) + "] 100% done", last.strip());
        // the shorter last text blanks out the rest of the longer one before it
        assertEquals(out.substring(1, out.indexOf('\r', 1)).length(), last.length() - 1);
    }

    @Test
    void elsewhereAPlainLinePerStepOrTenth() {
        StringWriter s = new StringWriter();
        ProgressBar bar = new ProgressBar(new PrintWriter(s), false);
        bar.progress(0.0, "reading a");
        bar.progress(0.01, "reading a");
        bar.progress(0.02, "reading b");
        bar.progress(0.31, "cv: fold 1 of 4: fitting forest");
        bar.progress(0.33, "cv: fold 1 of 4: fitting forest");
        bar.progress(1.0, "done");
        assertEquals(String.join("\n", "progress   0% reading a", "progress   2% reading b",
                "progress  31% cv: fold 1 of 4: fitting forest", "progress 100% done", ""),
                s.toString().replace(System.lineSeparator(), "\n"));
    }
}
