package org.pointcall.ui.cli;

import java.io.PrintWriter;
import java.util.Locale;

import org.pointcall.models.train.TrainingProgress;

/**
 * Draws a training run's progress: on a terminal one line rewritten in place, otherwise (a file, a pipe) a plain
 * line whenever the step changes or another tenth is done, so a log stays short.
 */
final class ProgressBar implements TrainingProgress {
    private static final int WIDTH = 30;
    private final PrintWriter out;
    private final boolean terminal;
    private int lastPercent = -1;
    private String lastStep = "";
    private int lastLength;

    ProgressBar(PrintWriter out, boolean terminal) {
        this.out = out;
        this.terminal = terminal;
    }

    @Override
    public void progress(double fractionDone, String label) {
        int percent = (int) Math.floor(Math.max(0, Math.min(1, fractionDone)) * 100);
        String step = label.contains(":") ? label.substring(0, label.lastIndexOf(':')) : label;
        if (terminal) {
            int filled = percent * WIDTH / 100;
            String line = String.format(Locale.ROOT, "[%s%s] %3d%% %s", "#".repeat(filled),
                    " ".repeat(WIDTH - filled), percent, label);
            // pad over the rest of a longer previous line
            out.print("\r" + line + " ".repeat(Math.max(0, lastLength - line.length())));
            lastLength = line.length();
            if (percent == 100) {
                out.println();
            }
            out.flush();
        } else if (percent / 10 != lastPercent / 10 || !step.equals(lastStep)) {
            out.printf(Locale.ROOT, "progress %3d%% %s%n", percent, label);
            out.flush();
        }
        lastPercent = percent;
        lastStep = step;
    }
}
