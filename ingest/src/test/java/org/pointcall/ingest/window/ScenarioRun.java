package org.pointcall.ingest.window;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assertions.fail;

import java.util.ArrayList;
import java.util.List;

import org.pointcall.ingest.frame.Frame;
import org.pointcall.shared.dictionary.Parameter;
import org.pointcall.shared.dictionary.ParameterDictionary;
import org.pointcall.shared.units.Unit;

/**
 * Feeds a generated frame stream to a real {@link FeatureExtractor} and, at every tick, checks every window against
 * {@link WindowReference}: validity and coverage exactly, statistics within the tolerances below; every
 * {@code commonsEvery}-th tick also against Apache Commons Math.
 *
 * <p>Tolerances, with eps = 2^-52 (double precision), u = eps / 2, and for a window of n samples, range R, largest
 * magnitude A and length L: c = 16 n eps = 32 n u. Min, max and change are picks of stored doubles and one
 * subtraction: compared exactly. The extractor's sums are taken about an anchor that is a sample of the current
 * window (|x - anchor| <= R, |t - anchor| <= L), rebuilt at most n removals ago and updated since by at most ~3n
 * additions. Even as plain sums, standard worst-case summation bounds would give: mean error <= 3 n u R + u A,
 * variance error <= ~9 n u R^2, slope error <= ~50 n u R L^2 / span^3 for times spread over the span
 * (S_tt ~ n span^2 / 12). The value sums are in fact compensated (TwoSum), which only lowers the first-order
 * error and leaves a second-order trace of samples that have left (~18 n u^2 times the range of the last 2 L, or
 * its square for the variance: below 1e-10 of R, or of R^2, even for a 1e6 step over 1e-3 noise). The checks
 * allow about 8 to 14 times those worst cases (real errors are far smaller): mean 4 eps A + c R; variance
 * (compared instead of std, so that small deviations stay meaningful) 4 c R^2; slope 16 c R L^2 / span^3
 * + 4 c |slope|. The references (corrected two-pass mean and deviations, centred regression; Commons Math's
 * two-pass Mean and Variance and its centred updating SimpleRegression, fed values relative to the window's first)
 * are at least as accurate, so the same bounds cover their error. A constant window (R = 0) must give std and
 * slope exactly 0.
 */
final class ScenarioRun {
    static final double EPS = Math.ulp(1.0);

    /** Fills frame {@code k} of the stream (the frame arrives cleared: all NaN, no flags). */
    @FunctionalInterface
    interface Filler {
        void fill(int k, Frame frame);
    }

    /** What a run checked, so tests can assert that the interesting cases occurred. */
    record Summary(long ticks, long validWindows, long invalidWindows, long commonsChecks, long recomputes,
                   FeatureExtractor extractor) {
    }

    static Parameter parameter(String name, double rateHz) {
        return new Parameter(name, Unit.NONE, "", rateHz, -1e12, 1e12, null, null, null);
    }

    static ParameterDictionary dictionary(Parameter... ps) {
        return new ParameterDictionary("test", List.of(ps));
    }

    static Summary run(ParameterDictionary dictionary, List<WindowSpec> specs, ExtractorSettings settings,
                       int frames, int commonsEvery, Filler filler) {
        int[] slots = new int[specs.size()];
        long[] maxGapNs = new long[specs.size()];
        for (int s = 0; s < specs.size(); s++) {
            slots[s] = dictionary.indexOf(specs.get(s).parameter());
            double gapS = Double.isNaN(specs.get(s).maxGapS())
                    ? settings.gapFactor() / dictionary.parameter(slots[s]).rateHz() : specs.get(s).maxGapS();
            maxGapNs[s] = Math.round(gapS * 1e9);
        }
        WindowReference ref = new WindowReference(slots, maxGapNs);
        List<String> specNames = new ArrayList<>();
        for (WindowSpec s : specs) {
            specNames.add(s.parameter());
        }
        boolean keep = settings.invalidWindow() == InvalidWindowPolicy.KEEP;
        long[] counts = new long[4];
        FeatureLayout[] bound = new FeatureLayout[1];
        FeatureListener check = new FeatureListener() {
            private long tickNo;

            @Override
            public void onFeatures(long timeNs, double[] features, boolean[] valid, double[] coverage) {
                FeatureLayout layout = bound[0];
                boolean withCommons = commonsEvery > 0 && tickNo++ % commonsEvery == 0;
                for (int w = 0; w < layout.windowCount(); w++) {
                    int p = specNames.indexOf(layout.windowParameter(w));
                    long lengthNs = Math.round(layout.windowLengthS(w) * 1e9);
                    WindowReference.Expected e = ref.expected(p, timeNs, lengthNs, settings.minSamples());
                    String where = layout.windowName(w) + " at " + timeNs + " ns (n=" + e.n() + ")";
                    assertEquals(e.valid(), valid[w], where + ": validity");
                    assertEquals(e.coverage(), coverage[w], 0.0, where + ": coverage");
                    int o = FeatureLayout.featureIndex(w, Stat.MEAN);
                    if (e.valid()) {
                        counts[1]++;
                    } else {
                        counts[2]++;
                    }
                    if (e.n() == 0 || !e.valid() && !keep) {
                        for (int i = 0; i < Stat.COUNT; i++) {
                            if (!Double.isNaN(features[o + i])) {
                                fail(where + ": " + layout.name(o + i) + " should be NaN, is " + features[o + i]);
                            }
                        }
                        continue;
                    }
                    double spanS = ref.spanS(p, e);
                    assertStats(where, e, features, o, layout.windowLengthS(w), spanS);
                    if (withCommons) {
                        assertStats(where + " vs Commons Math", ref.commons(p, e), features, o,
                                layout.windowLengthS(w), spanS);
                        counts[3]++;
                    }
                }
                counts[0]++;
            }
        };
        FeatureExtractor fx = FeatureExtractor.bind(dictionary, specs, settings, check);
        bound[0] = fx.layout();
        Frame f = Frame.forDictionary(dictionary);
        for (int k = 0; k < frames; k++) {
            f.clear();
            filler.fill(k, f);
            ref.record(f);
            fx.onFrame(f);
        }
        assertEquals(frames, fx.framesAccepted(), "every generated frame is in time order and accepted");
        assertEquals(counts[0], fx.ticksEmitted());
        assertTrue(counts[0] > 0, "the run reached at least one tick");
        return new Summary(counts[0], counts[1], counts[2], counts[3], fx.recomputes(), fx);
    }

    /** The tolerance checks described in the class comment. */
    static void assertStats(String where, WindowReference.Expected e, double[] f, int o, double lengthS,
                            double spanS) {
        int n = e.n();
        double c = 16 * n * EPS;
        double r = e.range();
        double a = Math.max(Math.abs(e.min()), Math.abs(e.max()));
        assertEquals(e.min(), f[o + Stat.MIN.ordinal()], 0.0, where + ": min");
        assertEquals(e.max(), f[o + Stat.MAX.ordinal()], 0.0, where + ": max");
        assertEquals(e.change(), f[o + Stat.CHANGE.ordinal()], 0.0, where + ": change");
        assertEquals(e.mean(), f[o + Stat.MEAN.ordinal()], 4 * EPS * a + c * r, where + ": mean");
        double std = f[o + Stat.STD.ordinal()];
        double slope = f[o + Stat.SLOPE.ordinal()];
        if (r == 0) {
            assertEquals(0.0, std, 0.0, where + ": std of a constant window");
            assertEquals(n > 1 ? 0.0 : Double.NaN, slope, 0.0, where + ": slope of a constant window");
            return;
        }
        assertEquals(e.std() * e.std(), std * std, 4 * c * r * r, where + ": variance");
        double slopeTol = 16 * c * r * lengthS * lengthS / (spanS * spanS * spanS) + 4 * c * Math.abs(e.slope());
        assertEquals(e.slope(), slope, slopeTol, where + ": slope");
    }

    private ScenarioRun() {
    }
}
