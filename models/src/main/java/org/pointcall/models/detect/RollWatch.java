package org.pointcall.models.detect;

/**
 * {@code roll-signature}: finds an aileron roll in the roll rate and bank alone, without the classifier, for an
 * airframe that rolls so fast (a full turn in about a second) that the classifier's windows hardly see it.
 *
 * <p>A roll starts where |P| rises above {@link #ONSET_RAD_S} after at least {@link #QUIET_NS} below it; from there
 * the bank change is accumulated sample to sample, each step the short way round (the +-180 deg wrap costs
 * nothing), and the roll rate integrated too (a rate gyro that saturates reads less than the bank turned); the
 * larger of the two reaching {@link #TURN_RAD} within {@link #MAX_ROLL_NS} is a roll. It ends where |P| last stood
 * above {@link #ONSET_RAD_S}; a run that falls quiet for {@link #QUIET_NS} before a full turn is not a roll. Nothing
 * else turns through a full circle of bank: a loop's Euler bank flips through 180 deg but its roll rate stays small,
 * which is why the bank steps are counted only while the roll rate is up.
 *
 * <p>Allocation-free; single-threaded, fed every frame.
 */
final class RollWatch {
    static final double DEG = Math.PI / 180;
    /** |P| above this is rolling (common practice: a held wings-level attitude stays within a few deg/s). */
    static final double ONSET_RAD_S = 10 * DEG;
    /** A full turn less the overshoot and undershoot a pilot stops short or long by (the roll-360 rule's 315). */
    static final double TURN_RAD = 315 * DEG;
    static final long QUIET_NS = 1_000_000_000L;
    static final long MAX_ROLL_NS = 10_000_000_000L;
    private static final long NONE = PointEvent.UNKNOWN_NS;

    private long quietSinceNs = NONE;
    private long startNs = NONE;
    private long lastActiveNs = NONE;
    private double bankTurned;
    private double rateTurned;
    private double lastBank = Double.NaN;
    private double lastP = Double.NaN;
    private long lastPNs = NONE;
    private boolean rolling;
    private boolean found;
    private long foundStartNs = NONE;
    private long foundEndNs = NONE;
    private double turned;

    void clear() {
        quietSinceNs = NONE;
        startNs = NONE;
        lastActiveNs = NONE;
        lastBank = Double.NaN;
        lastP = Double.NaN;
        lastPNs = NONE;
        rolling = false;
        reset();
    }

    /** Forgets the roll found, keeps watching. */
    void reset() {
        found = false;
        foundStartNs = NONE;
        foundEndNs = NONE;
    }

    /** A full roll has been seen and has ended (|P| back below the onset). */
    boolean found() {
        return found;
    }

    long startNs() {
        return foundStartNs;
    }

    long endNs() {
        return foundEndNs;
    }

    /** The bank turned by the roll found, rad (the larger of bank steps and integrated rate). */
    double turnedRad() {
        return turned;
    }

    void onState(PhysicalState s) {
        long t = s.timeNs();
        if (s.fresh(PhysicalQuantity.ROLL) && Double.isFinite(s.rollRad())) {
            double b = s.rollRad();
            if (rolling && Double.isFinite(lastBank)) {
                bankTurned += Math.IEEEremainder(b - lastBank, 2 * Math.PI);
            }
            lastBank = b;
        }
        if (!s.fresh(PhysicalQuantity.P) || !Double.isFinite(s.pRadS())) {
            return;
        }
        double p = s.pRadS();
        if (rolling && Double.isFinite(lastP) && lastPNs != NONE) {
            rateTurned += 0.5 * (p + lastP) * Math.min(0.1, (t - lastPNs) * 1e-9);
        }
        lastP = p;
        lastPNs = t;
        boolean active = Math.abs(p) > ONSET_RAD_S;
        if (active) {
            lastActiveNs = t;
            if (!rolling && quietSinceNs != NONE && t - quietSinceNs >= QUIET_NS) {
                rolling = true;
                startNs = t;
                bankTurned = 0;
                rateTurned = 0;
            }
            quietSinceNs = NONE;
        } else if (quietSinceNs == NONE) {
            quietSinceNs = t;
        }
        if (!rolling) {
            return;
        }
        double most = Math.max(Math.abs(bankTurned), Math.abs(rateTurned));
        boolean over = !active && lastActiveNs != NONE && t - lastActiveNs >= QUIET_NS / 4;
        if (most >= TURN_RAD && over) {
            found = true;
            foundStartNs = startNs;
            foundEndNs = lastActiveNs;
            turned = most;
            rolling = false;
        } else if (t - startNs > MAX_ROLL_NS || !active && quietSinceNs != NONE && t - quietSinceNs >= QUIET_NS) {
            rolling = false;
        }
    }
}
