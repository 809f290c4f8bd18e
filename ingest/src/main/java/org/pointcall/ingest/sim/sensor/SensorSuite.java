package org.pointcall.ingest.sim.sensor;

import java.util.Random;

import org.pointcall.ingest.frame.Frame;
import org.pointcall.shared.dictionary.Parameter;
import org.pointcall.shared.dictionary.ParameterDictionary;
import org.pointcall.shared.units.Dimension;

/**
 * Turns the simulator's true values into telemetry: each measured parameter sampled at its own nominal rate, through
 * a first-order lag, with bias, Gaussian noise, quantisation and rare wild points; the frame stream with dropouts
 * and time-stamp jitter. Everything is seeded: the same seed gives the same frames. Derived parameters are left NaN:
 * the ground derives them, as it would from a real aircraft.
 *
 * <p>Counts of what was spoilt are kept, so a test or the truth file can say how many wild points and dropped
 * frames the data holds.
 */
public final class SensorSuite {
    private final ParameterDictionary dictionary;
    private final SensorSettings settings;
    private final SensorSpec[] specs;
    private final boolean[] measured;
    private final long[] periodNs;
    private final long[] nextSampleNs;
    private final double[] lagged;
    private final Random noise;
    private final Random events;
    private long lastTimeNs = Long.MIN_VALUE;
    private long lastStampNs = Long.MIN_VALUE;
    private long dropoutUntilNs = Long.MIN_VALUE;
    private long nextDropoutNs;
    private boolean started;
    private long framesDropped;
    private long dropouts;
    private long wildPoints;

    public SensorSuite(ParameterDictionary dictionary, SensorSettings settings, long seed) {
        this.dictionary = dictionary;
        this.settings = settings;
        int n = dictionary.size();
        this.specs = new SensorSpec[n];
        this.measured = new boolean[n];
        this.periodNs = new long[n];
        this.nextSampleNs = new long[n];
        this.lagged = new double[n];
        for (int i = 0; i < n; i++) {
            Parameter p = dictionary.parameter(i);
            measured[i] = !p.isDerived();
            specs[i] = settings.clean() ? SensorSpec.CLEAN : scaled(defaultSpec(p), settings.scale());
            periodNs[i] = Math.round(1e9 / p.rateHz());
            lagged[i] = Double.NaN;
        }
        this.noise = new Random(seed);
        this.events = new Random(seed ^ 0x5DEECE66DL);
    }

    private static SensorSpec scaled(SensorSpec s, double k) {
        return new SensorSpec(s.noiseStd() * k, s.bias(), s.quantum(), s.lagS(), s.wildPerHour());
    }

    /**
     * Default transducer of a parameter, by what it measures: values of the order seen on instrumented trainers,
     * invented for the demo and not taken from any data sheet (common practice in kind, values [memory]).
     */
    public static SensorSpec defaultSpec(Parameter p) {
        double span = p.validMax() - p.validMin();
        Dimension d = p.unit().dimension();
        String n = p.name();
        if (p.unit() == org.pointcall.shared.units.Unit.NONE) {
            return SensorSpec.CLEAN; // discretes (gear, flap selector) read exactly
        }
        switch (d) {
            case PRESSURE:
                // 0.05 hPa noise and 0.01 hPa LSB on a 0-1100 hPa channel; pneumatic line lag 50 ms.
                return new SensorSpec(p.unit().fromSi(5.0) - p.unit().fromSi(0), 0, p.unit().fromSi(1.0)
                        - p.unit().fromSi(0), 0.05, 0.5);
            case TEMPERATURE:
                return new SensorSpec(0.1, 0.2, 0.05, 1.5, 0.2);
            case ANGLE:
                if (n.equalsIgnoreCase("AoA") || n.equalsIgnoreCase("AoS")) {
                    return new SensorSpec(0.1, 0.0, 0.01, 0.03, 1.0); // vanes: noisy and a little lagged
                }
                return new SensorSpec(0.02, 0.0, 0.005, 0.0, 0.2);
            case ANGULAR_RATE:
                return new SensorSpec(0.1, 0.05, 0.01, 0.0, 0.2);
            case LOAD_FACTOR:
                return new SensorSpec(0.01, 0.0, 0.001, 0.0, 0.5);
            default:
                return new SensorSpec(span * 2e-4, 0.0, span * 1e-5, 0.0, 0.1);
        }
    }

    public ParameterDictionary dictionary() {
        return dictionary;
    }

    public SensorSpec spec(int slot) {
        return specs[slot];
    }

    /**
     * Samples the truth at {@code timeNs} (true values per slot, in each parameter's unit; NaN where the simulator
     * has none) into {@code out}.
     *
     * @return false when this frame falls in a telemetry dropout and must not be sent
     */
    public boolean sample(long timeNs, double[] truth, Frame out) {
        if (!started) {
            started = true;
            for (int i = 0; i < nextSampleNs.length; i++) {
                nextSampleNs[i] = timeNs;
            }
            nextDropoutNs = timeNs + nextDropoutGapNs();
        }
        double dtS = lastTimeNs == Long.MIN_VALUE ? 0 : (timeNs - lastTimeNs) * 1e-9;
        lastTimeNs = timeNs;
        // Lags run on every step, sampled or not, as the physical probe does.
        for (int i = 0; i < truth.length; i++) {
            double v = truth[i];
            double lagS = specs[i].lagS();
            if (Double.isNaN(lagged[i]) || lagS == 0 || dtS == 0) {
                lagged[i] = v;
            } else if (!Double.isNaN(v)) {
                lagged[i] += (v - lagged[i]) * (1 - Math.exp(-dtS / lagS));
            }
        }
        boolean inDropout = false;
        if (!settings.clean() && settings.dropoutsPerHour() > 0) {
            if (timeNs >= nextDropoutNs) {
                dropouts++;
                dropoutUntilNs = timeNs + Math.round(-Math.log(1 - events.nextDouble()) * settings.dropoutMeanS() * 1e9);
                nextDropoutNs = dropoutUntilNs + nextDropoutGapNs();
            }
            inDropout = timeNs < dropoutUntilNs;
        }
        out.clear();
        long stamp = timeNs;
        if (!settings.clean() && settings.timeJitterStdS() > 0) {
            stamp += Math.round(noise.nextGaussian() * settings.timeJitterStdS() * 1e9);
        }
        if (stamp <= lastStampNs) {
            stamp = lastStampNs + 1;
        }
        lastStampNs = stamp;
        out.timeNs(stamp);
        int wildHere = 0;
        for (int i = 0; i < truth.length; i++) {
            if (!measured[i] || timeNs < nextSampleNs[i]) {
                continue;
            }
            nextSampleNs[i] += periodNs[i];
            if (nextSampleNs[i] <= timeNs) {
                nextSampleNs[i] = timeNs + periodNs[i]; // a frame rate below the parameter's own: one per frame
            }
            double v = lagged[i];
            if (Double.isNaN(v)) {
                continue;
            }
            SensorSpec s = specs[i];
            v += s.bias();
            if (s.noiseStd() > 0) {
                v += s.noiseStd() * noise.nextGaussian();
            }
            if (s.quantum() > 0) {
                v = Math.round(v / s.quantum()) * s.quantum();
            }
            v = channel(dictionary.parameter(i), v);
            if (s.wildPerHour() > 0 && events.nextDouble() < s.wildPerHour() * periodNs[i] / 3.6e12) {
                Parameter p = dictionary.parameter(i);
                v = p.validMax() + (p.validMax() - p.validMin()) * (1 + events.nextDouble());
                wildHere++;
            }
            out.value(i, v);
        }
        if (inDropout) {
            framesDropped++;
            return false;
        }
        wildPoints += wildHere; // only those that reach the link count: a dropped frame's are never seen
        return true;
    }

    /**
     * What the channel makes of a value: an angle whose range is one full turn wraps into it (heading 0 to 360,
     * bank -180 to 180); anything else saturates at the ends of its range, as a transducer or an ADC does.
     */
    private static double channel(Parameter p, double v) {
        double lo = p.validMin();
        double hi = p.validMax();
        if (p.unit().dimension() == Dimension.ANGLE && Math.abs(p.unit().toSi(hi) - p.unit().toSi(lo) - 2 * Math.PI) < 1e-9) {
            double turn = hi - lo;
            double w = (v - lo) % turn;
            return (w < 0 ? w + turn : w) + lo;
        }
        return Math.max(lo, Math.min(hi, v));
    }

    private long nextDropoutGapNs() {
        if (settings.clean() || settings.dropoutsPerHour() <= 0) {
            return Long.MAX_VALUE / 4;
        }
        return Math.round(-Math.log(1 - events.nextDouble()) * 3600e9 / settings.dropoutsPerHour());
    }

    public long framesDropped() {
        return framesDropped;
    }

    public long dropouts() {
        return dropouts;
    }

    public long wildPoints() {
        return wildPoints;
    }
}
