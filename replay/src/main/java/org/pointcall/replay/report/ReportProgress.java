package org.pointcall.replay.report;

/**
 * Told how far a report run has got, on the thread doing it: the command line draws a progress bar from it. The
 * fraction never decreases and reaches 1 when the run is done.
 */
@FunctionalInterface
public interface ReportProgress {
    /** Ignores every report. */
    ReportProgress NONE = (fraction, label) -> {
    };

    /**
     * @param fractionDone share of the run done, in [0, 1]
     * @param label        what is being done now ({@code figure 3 of 12: LP-1})
     */
    void progress(double fractionDone, String label);

    /** This progress scaled into {@code [from, to]} of an enclosing run. */
    default ReportProgress within(double from, double to) {
        ReportProgress outer = this;
        return (f, label) -> outer.progress(from + (to - from) * Math.max(0, Math.min(1, f)), label);
    }
}
