package org.pointcall.ingest.sim.pilot;

/**
 * A loop: full power, wings level, pull to the set g in about a second and hold it up to the vertical; over the
 * top the angle of attack is held to a few degrees more than it was going up, so the g eases as the speed falls
 * (it keeps the speed); past the apex the g that bottoms the loop out at the entry altitude (at most 1 g more
 * than set), within the manoeuvring angle-of-attack limit, until the flight path is level again.
 * Bank is measured against the loop's own vertical plane (Euler angles fold at the vertical), and a small bank
 * correction keeps the track on the entry heading.
 */
final class LoopTechnique extends Technique {
    private enum Phase { PULL, OVER, EXIT, LEVEL }

    private static final double ONSET_G_PER_S = 3.0;
    /** Over the top, the angle of attack may grow this much past that of the pull. */
    private static final double OVER_TOP_ALPHA_RAD = 4.0 * DEG;

    private Phase phase;
    private double psi0;
    private double planeN;
    private double planeE;
    private double nzCmd;
    private double alphaPull = Double.NaN;
    private boolean pullMarked;
    private double loopAngle;
    private double lastRaw;
    private double hpLevel;
    private double levelS;
    private double manoeuvreCap;
    private double hpEntry;

    LoopTechnique(PointPlan plan, Loops loops, Envelope envelope, Limits limits, PilotListener listener) {
        super(plan, loops, envelope, limits, listener);
    }

    @Override
    void start(SensedState s) {
        phase = Phase.PULL;
        psi0 = s.psiRad;
        planeN = -Math.sin(psi0);
        planeE = Math.cos(psi0);
        nzCmd = s.nz;
        loopAngle = 0.0;
        lastRaw = rawAngle(s);
        manoeuvreCap = loops.alphaCapRad;
        hpEntry = s.hpM;
        loops.throttleHold(1.0);
    }

    /** Angle of the velocity in the loop plane: 0 level on the entry heading, 90 up, 180 inverted. */
    private double rawAngle(SensedState s) {
        double along = s.velNorthMps * Math.cos(psi0) + s.velEastMps * Math.sin(psi0);
        return Math.atan2(-s.velDownMps, along);
    }

    /** Bank against the loop plane: rotation of the body y axis about x from the plane's normal. */
    private double planeBank(SensedState s) {
        double yn = s.yN * planeN + s.yE * planeE;
        double zn = s.zN * planeN + s.zE * planeE;
        return Math.atan2(-zn, yn);
    }

    /**
     * Load factor that bottoms the loop out at the entry altitude: the remaining arc from loop angle psi to 360
     * deg descends {@code R (1 - cos psi)}, and a circle of radius R at speed V needs {@code V^2/(g R) + cos psi}
     * (V taken as the mean of now and the bottom, where the height has turned into speed).
     */
    private double exitNz(SensedState s, double target) {
        double psi = loopAngle;
        double dh = s.hpM - hpEntry;
        double drop = 1.0 - Math.cos(psi);
        double nzMax = Math.min(limits.nzMax - 0.5, target + 1.0);
        if (dh <= 0.0) {
            return nzMax;
        }
        if (drop < 0.035) {
            return Math.min(target, loops.nzForGamma(s, 0.0));
        }
        double radius = dh / drop;
        double v2 = s.tasMps * s.tasMps + SensedState.G * dh;
        double n = v2 / (SensedState.G * radius) + Math.cos(psi);
        return Loops.clamp(n, 1.0, nzMax);
    }

    @Override
    boolean tick(SensedState s, double dtS) {
        double raw = rawAngle(s);
        loopAngle += SensedState.wrap(raw - lastRaw);
        lastRaw = raw;
        loops.throttleHold(1.0);
        double target = plan.nzTarget;
        switch (phase) {
            case PULL -> {
                nzCmd = Math.min(target, nzCmd + ONSET_G_PER_S * dtS);
                loops.pitchNz(s, nzCmd, dtS);
                if (!pullMarked && s.nz >= target - 0.1) {
                    pullMarked = true;
                    mark("pull", s);
                }
                if (loopAngle > 80 * DEG) {
                    alphaPull = s.alphaRad;
                    phase = Phase.OVER;
                }
            }
            case OVER -> {
                // over the top the g eases with the speed: the angle of attack of the pull plus a little
                loops.alphaCapRad = Math.min(alphaPull + OVER_TOP_ALPHA_RAD, manoeuvreCap);
                loops.pitchNz(s, target, dtS);
                if (loopAngle > 200 * DEG) {
                    phase = Phase.EXIT;
                    loops.alphaCapRad = manoeuvreCap;
                }
            }
            case EXIT -> {
                loops.pitchNz(s, exitNz(s, target), dtS);
                if (loopAngle >= 2.0 * Math.PI - 0.5 * DEG) {
                    mark("exit", s);
                    phase = Phase.LEVEL;
                    hpLevel = s.hpM;
                    levelS = s.timeS;
                }
            }
            case LEVEL -> {
                loops.alphaCapRad = manoeuvreCap;
                flyLevel(s, hpLevel, entryTas(s), psi0, 20 * DEG, dtS);
                return !(steadyFor(s, 2.0) || s.timeS - levelS > 20.0);
            }
        }
        if (phase != Phase.LEVEL) {
            double vn = s.velNorthMps * planeN + s.velEastMps * planeE;
            double v = Math.sqrt(s.velNorthMps * s.velNorthMps + s.velEastMps * s.velEastMps
                    + s.velDownMps * s.velDownMps);
            double track = Math.asin(Loops.clamp(vn / Math.max(v, 1.0), -1.0, 1.0));
            double bankCmd = Loops.clamp(-2.0 * track, -8 * DEG, 8 * DEG);
            loops.rollBankError(s, bankCmd - planeBank(s), 30 * DEG, dtS);
            loops.yawBeta(s, 0.0, dtS);
        }
        if (s.timeS - beginS > 120.0) {
            return false;
        }
        return true;
    }
}
