package org.pointcall.models.train;

/**
 * Told how far a training run has got, on the training thread: the command line draws a progress bar from it. The
 * fraction never decreases and reaches 1 when the run is done.
 */
@FunctionalInterface
public interface TrainingProgress {
    /** Ignores every report. */
    TrainingProgress NONE = (fraction, label) -> {
    };

    /**
     * @param fractionDone share of the run done, in [0, 1]
     * @param label        what is being done now, for example {@code fold 2 of 5: fitting forest}
     */
    void progress(double fractionDone, String label);

    /** This progress scaled into {@code [from, to]} of an enclosing run, labels prefixed with {@code prefix}. */
    default TrainingProgress within(double from, double to, String prefix) {
        TrainingProgress outer = this;
        return (f, label) -> outer.progress(from + (to - from) * f, prefix.isEmpty() ? label : prefix + ": " + label);
    }
}
