package org.pointcall.ingest.window;

import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;

import org.pointcall.ingest.frame.Frame;
import org.pointcall.shared.dictionary.Parameter;
import org.pointcall.shared.dictionary.ParameterDictionary;
import org.pointcall.shared.units.Unit;

/**
 * The reference workload W1 for feature extraction: 256 parameters in frames at 1,000 frames per second, features
 * on 24 of them over 0.5, 2 and 8 s windows at 20 Hz. Parameter rates cycle through 1000, 200, 50 and 10 Hz in
 * blocks of ten slots (a slower parameter is NaN in the frames between its samples), so the 24 selected ones, at
 * every tenth slot, have six of each rate. Values are seeded sines plus Gaussian noise around offsets up to 1e4.
 */
public final class W1Workload {
    public static final int PARAMETERS = 256;
    public static final int FRAME_RATE_HZ = 1000;
    public static final int SELECTED = 24;
    public static final long FRAME_INTERVAL_NS = 1_000_000_000L / FRAME_RATE_HZ;
    private static final int[] RATES_HZ = {1000, 200, 50, 10};
    private static final double[] WINDOWS_S = {0.5, 2.0, 8.0};

    private W1Workload() {
    }

    static int rateHz(int slot) {
        return RATES_HZ[(slot / 10) % RATES_HZ.length];
    }

    public static ParameterDictionary dictionary() {
        List<Parameter> ps = new ArrayList<>(PARAMETERS);
        for (int s = 0; s < PARAMETERS; s++) {
            ps.add(new Parameter(String.format("P%03d", s), Unit.NONE, "synthetic W1 parameter", rateHz(s), -1e6, 1e6,
                    null, null, null));
        }
        return new ParameterDictionary("W1", ps);
    }

    /** Window specs of the 24 selected parameters (slots 0, 10, ..., 230). */
    public static List<WindowSpec> specs() {
        List<WindowSpec> specs = new ArrayList<>(SELECTED);
        for (int i = 0; i < SELECTED; i++) {
            specs.add(WindowSpec.of(String.format("P%03d", i * 10), WINDOWS_S));
        }
        return specs;
    }

    public static ExtractorSettings settings() {
        return ExtractorSettings.defaults().withDecisionRateHz(20.0);
    }

    /** {@code count} consecutive frames from time 0, with sequence numbers 0.., seeded. */
    public static Frame[] frames(int count, long seed) {
        SplittableRandom rnd = new SplittableRandom(seed);
        double[] offset = new double[PARAMETERS];
        double[] amplitude = new double[PARAMETERS];
        double[] omega = new double[PARAMETERS];
        double[] noise = new double[PARAMETERS];
        int[] every = new int[PARAMETERS];
        for (int s = 0; s < PARAMETERS; s++) {
            offset[s] = rnd.nextDouble(-1e4, 1e4);
            amplitude[s] = rnd.nextDouble(0.1, 50.0);
            omega[s] = 2 * Math.PI * rnd.nextDouble(0.01, 2.0);
            noise[s] = rnd.nextDouble(1e-3, 1.0);
            every[s] = FRAME_RATE_HZ / rateHz(s);
        }
        Frame[] frames = new Frame[count];
        for (int k = 0; k < count; k++) {
            Frame f = new Frame(PARAMETERS);
            f.timeNs(k * FRAME_INTERVAL_NS);
            f.sequence(k);
            double tS = k / (double) FRAME_RATE_HZ;
            for (int s = 0; s < PARAMETERS; s++) {
                if (k % every[s] == 0) {
                    f.value(s, offset[s] + amplitude[s] * Math.sin(omega[s] * tS) + noise[s] * rnd.nextGaussian());
                }
            }
            frames[k] = f;
        }
        return frames;
    }
}
