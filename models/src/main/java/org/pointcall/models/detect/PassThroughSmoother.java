package org.pointcall.models.detect;

/** No smoothing: the output is the input. */
final class PassThroughSmoother implements Smoother {
    private final int classes;

    PassThroughSmoother(int classes) {
        if (classes <= 0) {
            throw new IllegalArgumentException("need at least one class");
        }
        this.classes = classes;
    }

    @Override
    public void reset() {
        // nothing held
    }

    @Override
    public void smooth(long timeNs, double[] raw, double[] out) {
        System.arraycopy(raw, 0, out, 0, classes);
    }

    @Override
    public double stepDelayS(double from, double to, double threshold) {
        if (from > threshold) {
            return 0.0;
        }
        return to > threshold ? 0.0 : Double.POSITIVE_INFINITY;
    }
}
