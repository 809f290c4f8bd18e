package org.pointcall.models.detect;

import java.util.Locale;

/**
 * {@code doublet-signature}: finds a pitch doublet in the pitch rate alone, without the classifier, for an aircraft
 * whose short period is so well damped that the classifier's windows hardly see it.
 *
 * <p>What it looks for, in order (every threshold a rate or an angle of any airframe, none a figure of one type):
 * <ol>
 *   <li>quiet pitch rate (|Q| at or below {@link #QUIET_RAD_S}) for {@link #QUIET_BEFORE_NS} before the input;</li>
 *   <li>the input: a lobe of one sign peaking at {@link #PEAK_RAD_S} or more, at most {@link #MAX_LOBE_NS} long,
 *       followed within {@link #MAX_GAP_NS} by a lobe of the other sign, at least half its peak and as short; the
 *       two lobes' areas nearly cancel (the attitude comes back: a doublet, not a pull into a climb);</li>
 *   <li>the free response: any further lobes smaller than the input's, within {@link #SETTLE_NS} of the release,
 *       then quiet; the point is reported begun after {@link #BEGIN_QUIET_NS} of quiet and confirmed after
 *       {@link #CONFIRM_QUIET_NS}, with the speed still within {@link #SPEED_HOLD_MPS} of its value at the input
 *       (a stall's entry, with its pitch-ups at idle power, slows down);</li>
 *   <li>the end: the pilot's next input (the next lobe after the confirmation), or {@link #RECORD_NS} after the
 *       release, whichever is first.</li>
 * </ol>
 * Lobes shorter than {@link #MIN_LOBE_NS} are wild points or noise and are ignored. Speed at the input is the median
 * of the last {@value #SPEEDS} CAS samples taken a quarter of a second apart, so a wild sample does not move it.
 *
 * <p>Common practice rather than a published figure: a deliberate doublet drives a few degrees per second of pitch
 * rate in about a second each way; the controls are then held fixed for several seconds of free response. The
 * thresholds are chosen well below the first and above the noise of a vane-free rate gyro.
 *
 * <p>Allocation-free; single-threaded, fed every frame.
 */
final class DoubletWatch {
    static final double DEG = Math.PI / 180;
    static final double QUIET_RAD_S = 1.0 * DEG;
    static final double PEAK_RAD_S = 2.5 * DEG;
    static final long MIN_LOBE_NS = 100_000_000L;
    static final long MAX_LOBE_NS = 2_500_000_000L;
    static final long MAX_GAP_NS = 1_500_000_000L;
    static final long QUIET_BEFORE_NS = 2_000_000_000L;
    static final long SETTLE_NS = 6_000_000_000L;
    static final long BEGIN_QUIET_NS = 1_000_000_000L;
    static final long CONFIRM_QUIET_NS = 3_000_000_000L;
    static final long RECORD_NS = 8_000_000_000L;
    static final double SPEED_HOLD_MPS = 3 * 0.514444;
    static final double MAX_NET_FRACTION = 0.4;
    static final double MAX_BANK_RAD = 30 * DEG;
    private static final int SPEEDS = 8;
    private static final long SPEED_STEP_NS = 250_000_000L;
    private static final long NONE = PointEvent.UNKNOWN_NS;

    /** Nothing found yet. */
    static final int SEARCHING = 0;
    /** Input seen and settled for a second: the point has begun. */
    static final int BEGUN = 1;
    /** Settled for long enough with the speed held: a doublet. */
    static final int CONFIRMED = 2;
    /** Confirmed and over: {@link #endNs()} is known. */
    static final int ENDED = 3;
    /** Begun, then shown not to be a doublet. */
    static final int FAILED = 4;

    // the lobe being built
    private int runSign;
    private long runStartNs = NONE;
    private long runLastNs = NONE;
    private double runPeak;
    private double runSigned;
    private double runAbs;
    private long lastSampleNs = NONE;

    // the last counted lobe, a first-lobe candidate
    private boolean haveA;
    private int aSign;
    private long aStartNs;
    private long aEndNs;
    private double aPeak;
    private double aSigned;
    private double aAbs;
    private double aSpeed;
    private double aBank;
    private long quietSinceNs = NONE;

    private int status = SEARCHING;
    private long inputNs = NONE;
    private long releaseNs = NONE;
    private long endNs = NONE;
    private double inputPeak;
    private double responsePeak;
    private double speedAtInput = Double.NaN;
    private double speedNow = Double.NaN;
    private String failure;

    private final double[] speeds = new double[SPEEDS];
    private final double[] sorted = new double[SPEEDS];
    private int speedCount;
    private int speedNext;
    private long lastSpeedNs = NONE;
    private double bankNow = Double.NaN;

    void clear() {
        runStartNs = NONE;
        lastSampleNs = NONE;
        haveA = false;
        quietSinceNs = NONE;
        speedCount = 0;
        speedNext = 0;
        lastSpeedNs = NONE;
        bankNow = Double.NaN;
        reset();
    }

    /** Back to searching, keeping the lobe being built and the quiet so far. */
    void reset() {
        status = SEARCHING;
        inputNs = NONE;
        releaseNs = NONE;
        endNs = NONE;
        failure = null;
    }

    int status() {
        return status == BEGUN_PENDING ? SEARCHING : status;
    }

    /** Start of the input's first lobe. */
    long inputNs() {
        return inputNs;
    }

    /** End of the input's second lobe. */
    long releaseNs() {
        return releaseNs;
    }

    long endNs() {
        return endNs;
    }

    String failure() {
        return failure;
    }

    void onState(PhysicalState s) {
        long t = s.timeNs();
        if (s.fresh(PhysicalQuantity.CAS) && Double.isFinite(s.casMps())
                && (lastSpeedNs == NONE || t - lastSpeedNs >= SPEED_STEP_NS)) {
            lastSpeedNs = t;
            speeds[speedNext] = s.casMps();
            speedNext = (speedNext + 1) % SPEEDS;
            speedCount = Math.min(SPEEDS, speedCount + 1);
            speedNow = medianSpeed();
        }
        if (s.fresh(PhysicalQuantity.ROLL) && Double.isFinite(s.rollRad())) {
            bankNow = s.rollRad();
        }
        if (!s.fresh(PhysicalQuantity.Q) || !Double.isFinite(s.qRadS())) {
            return;
        }
        double q = s.qRadS();
        double aq = Math.abs(q);
        int sign = aq <= QUIET_RAD_S ? 0 : q > 0 ? 1 : -1;
        double dt = lastSampleNs == NONE ? 0 : Math.min(0.1, (t - lastSampleNs) / 1e9);
        lastSampleNs = t;
        if (runStartNs != NONE && sign != runSign) {
            endRun();
        }
        if (sign != 0) {
            if (runStartNs == NONE) {
                runSign = sign;
                runStartNs = t;
                runPeak = 0;
                runSigned = 0;
                runAbs = 0;
            }
            runLastNs = t;
            runPeak = Math.max(runPeak, aq);
            runSigned += q * dt;
            runAbs += aq * dt;
        } else if (quietSinceNs == NONE) {
            quietSinceNs = t;
        }
        step(t, sign == 0);
    }

    /** The lobe being built has ended (quiet, or the sign changed). */
    private void endRun() {
        long start = runStartNs;
        runStartNs = NONE;
        if (runLastNs - start < MIN_LOBE_NS) {
            return;
        }
        onLobe(runSign, start, runLastNs, runPeak, runSigned, runAbs);
    }

    private void onLobe(int sign, long start, long end, double peak, double signed, double abs) {
        long quietBefore = quietSinceNs == NONE ? 0 : start - quietSinceNs;
        quietSinceNs = NONE;
        if (status == CONFIRMED) {
            // the pilot's next input ends the controls-fixed response
            endNs = Math.min(start, releaseNs + RECORD_NS);
            status = ENDED;
            haveA = false;
            return;
        }
        if (status == BEGUN || status == BEGUN_PENDING) {
            if (peak >= inputPeak || start - releaseNs > SETTLE_NS) {
                if (status == BEGUN) {
                    fail(String.format(Locale.ROOT, "a %.1f deg/s pitch-rate lobe %.1f s after the release",
                            peak / DEG, (start - releaseNs) / 1e9));
                } else {
                    status = SEARCHING;
                }
            } else {
                responsePeak = Math.max(responsePeak, peak);
            }
            haveA = false;
            return;
        }
        if (status != SEARCHING) {
            haveA = false;
            return;
        }
        long dur = end - start;
        if (haveA && sign != aSign && start - aEndNs <= MAX_GAP_NS && peak >= 0.5 * aPeak && dur <= MAX_LOBE_NS
                && Math.abs(aSigned + signed) <= MAX_NET_FRACTION * (aAbs + abs)
                && !(Math.abs(aBank) > MAX_BANK_RAD)) {
            status = BEGUN_PENDING;
            inputNs = aStartNs;
            releaseNs = end;
            inputPeak = Math.max(aPeak, peak);
            responsePeak = 0;
            speedAtInput = aSpeed;
            haveA = false;
            return;
        }
        haveA = peak >= PEAK_RAD_S && dur <= MAX_LOBE_NS && quietBefore >= QUIET_BEFORE_NS;
        if (haveA) {
            aSign = sign;
            aStartNs = start;
            aEndNs = end;
            aPeak = peak;
            aSigned = signed;
            aAbs = abs;
            aSpeed = speedNow;
            aBank = bankNow;
        }
    }

    /** Input seen, response not yet settled for the begin: internal, reported as {@link #SEARCHING}. */
    private static final int BEGUN_PENDING = 5;

    private void step(long t, boolean quiet) {
        if (status == BEGUN_PENDING) {
            if (quiet && quietSinceNs != NONE && t - quietSinceNs >= BEGIN_QUIET_NS) {
                status = BEGUN;
            } else if (t - releaseNs > SETTLE_NS) {
                status = SEARCHING;
            }
            return;
        }
        if (status == BEGUN) {
            if (Double.isFinite(speedAtInput) && Double.isFinite(speedNow)
                    && Math.abs(speedNow - speedAtInput) > SPEED_HOLD_MPS) {
                fail(String.format(Locale.ROOT, "CAS changed %.1f kt since the input",
                        (speedNow - speedAtInput) / 0.514444));
            } else if (quiet && quietSinceNs != NONE && t - quietSinceNs >= CONFIRM_QUIET_NS) {
                status = CONFIRMED;
            } else if (t - releaseNs > SETTLE_NS + CONFIRM_QUIET_NS) {
                fail("no settled response");
            }
            return;
        }
        if (status == CONFIRMED && runStartNs != NONE && runLastNs - runStartNs >= MIN_LOBE_NS) {
            // the pilot's next input, seen as soon as it is more than noise
            endNs = Math.min(runStartNs, releaseNs + RECORD_NS);
            status = ENDED;
        } else if (status == CONFIRMED && t - releaseNs >= RECORD_NS) {
            endNs = releaseNs + RECORD_NS;
            status = ENDED;
        }
    }

    private void fail(String why) {
        status = FAILED;
        failure = why;
    }

    /** What the watch found, for evidence lines. */
    String describe() {
        return String.format(Locale.ROOT, "pitch-rate input from %.3f s to %.3f s, peak %.1f deg/s, response peak"
                + " %.1f deg/s, then quiet", inputNs / 1e9, releaseNs / 1e9, inputPeak / DEG, responsePeak / DEG);
    }

    private double medianSpeed() {
        System.arraycopy(speeds, 0, sorted, 0, speedCount);
        java.util.Arrays.sort(sorted, 0, speedCount);
        return speedCount % 2 == 1 ? sorted[speedCount / 2]
                : 0.5 * (sorted[speedCount / 2 - 1] + sorted[speedCount / 2]);
    }
}
