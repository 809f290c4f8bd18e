package org.pointcall.ingest.sim.pilot;

/**
 * Wings-level and turning stalls: throttle to idle, then slow at the set entry rate with pitch alone (the rate is
 * flown, the altitude is what it has to be: EASA AMC 25.103), wings level on the heading or at the set bank. In the
 * stall warning (the AoA within 0.3 deg of that of the largest lift) the stick comes only slowly aft, so that the
 * aircraft breaks, not the pilot; the pilot calls the stall when the g breaks (0.05 g below its best since the
 * warning), the nose drops, a wing drops or the AoA reaches the pilot's limit. Then the recovery: a brisk push and
 * unload below the reattachment angle for a second, wings level, full power; pull out of the dive at no more than
 * 2 g and 2 deg short of the largest lift; level off and accelerate back to the speed of the entry.
 */
final class StallTechnique extends Technique {
    private enum Phase { DECEL, APPROACH, UNLOAD, PULL_OUT, SETTLE }

    /** Aft stick rate once in the stall warning, rad/s: slow, so that the aircraft, not the pilot, breaks. */
    private static final double AFT_RATE_RAD_S = 0.5 * DEG;

    private Phase phase;
    private double v0Cas;
    private double headingRad;
    private double breakS;
    private double nzPeak;
    private double hpSettle;
    private double alphaStallCap;
    private double elevatorAft;
    private double thetaPeak;
    private double unloadedSinceS;

    StallTechnique(PointPlan plan, Loops loops, Envelope envelope, Limits limits, PilotListener listener) {
        super(plan, loops, envelope, limits, listener);
    }

    @Override
    void start(SensedState s) {
        phase = Phase.DECEL;
        v0Cas = s.casMps;
        headingRad = s.psiRad;
        alphaStallCap = Math.min(limits.alphaMaxRad - 0.4 * DEG, envelope.alphaStallRad() + 2.5 * DEG);
        loops.alphaCapRad = alphaStallCap;
        loops.throttleHold(0.0);
    }

    @Override
    boolean tick(SensedState s, double dtS) {
        switch (phase) {
            case DECEL, APPROACH -> decel(s, dtS);
            case UNLOAD -> unload(s, dtS);
            case PULL_OUT -> pullOut(s, dtS);
            case SETTLE -> {
                double cas = plan.entryCasMps() * Math.sqrt(Math.cos(plan.bankRad));
                flyLevel(s, hpSettle, s.tasForCas(cas), headingRad, 20 * DEG, dtS);
                if ((s.casMps > 0.95 * cas && steadyFor(s, 2.0)) || s.timeS - breakS > 90.0) {
                    return false;
                }
            }
        }
        return true;
    }

    private void decel(SensedState s, double dtS) {
        double t = s.timeS - beginS;
        double bank = plan.bankRad != 0.0 ? plan.bankRad
                : plan.wingsLevelBankRad + loops.bankForHeading(s, headingRad, 5 * DEG);
        if (phase == Phase.DECEL) {
            double ratio = s.tasMps / Math.max(s.casMps, 1.0);
            double vRef = v0Cas - plan.entryRateMps2 * t;
            double vDot = (-plan.entryRateMps2 + 0.3 * (vRef - s.casMps)) * ratio;
            double gamma = Loops.clamp(Loops.gammaForAccel(s, vDot), -10 * DEG, 10 * DEG);
            loops.pitchNz(s, Loops.clamp(loops.nzForGamma(s, gamma), 0.5, 2.0), dtS);
            if (s.alphaRad > envelope.alphaMaxLiftRad() - 0.3 * DEG) {
                // stall warning: from here the stick only comes slowly aft, until the aircraft breaks
                phase = Phase.APPROACH;
                elevatorAft = loops.elevator();
                thetaPeak = s.thetaRad;
                nzPeak = s.nz;
            }
        } else {
            elevatorAft -= AFT_RATE_RAD_S * plan.entryRateMps2 / (1.0 * 1852.0 / 3600.0) * dtS;
            loops.pitchHold(elevatorAft);
            thetaPeak = Math.max(thetaPeak, s.thetaRad);
            nzPeak = Math.max(nzPeak, s.nz);
        }
        loops.throttleHold(0.0);
        loops.rollToBank(s, bank, 10 * DEG, dtS);
        loops.yawBeta(s, 0.0, dtS);

        // the pilot's sight of the stall: the nose drops, the g breaks, a wing drops, or the AoA limit
        boolean approach = phase == Phase.APPROACH;
        boolean alphaLimit = s.alphaRad >= alphaStallCap - 0.15 * DEG;
        boolean noseDrop = approach && (s.qRadS < -1.5 * DEG || s.thetaRad < thetaPeak - 1.5 * DEG);
        boolean gBreak = approach && s.nz < nzPeak - 0.05;
        boolean wingDrop = Math.abs(s.pRadS) > 12 * DEG || Math.abs(SensedState.wrap(s.phiRad - bank)) > 10 * DEG;
        boolean timeout = t > 150.0;
        if (alphaLimit || noseDrop || gBreak || wingDrop || timeout) {
            breakS = s.timeS;
            unloadedSinceS = Double.NaN;
            phase = Phase.UNLOAD;
            mark("break-seen", s);
            // a brisk push: the stick goes forward at once, not smoothed
            loops.pitchHold(loops.elevator() + 4.0 * DEG);
        }
    }

    private void unload(SensedState s, double dtS) {
        loops.throttleHold(1.0);
        loops.alphaCapRad = alphaStallCap;
        loops.pitchAlpha(s, envelope.alphaReattachRad() - 3.0 * DEG, dtS);
        loops.rollToBank(s, 0.0, 60 * DEG, dtS);
        loops.yawBeta(s, 0.0, dtS);
        if (s.alphaRad < envelope.alphaReattachRad() - 1.5 * DEG) {
            if (Double.isNaN(unloadedSinceS)) {
                unloadedSinceS = s.timeS;
            }
        } else {
            unloadedSinceS = Double.NaN;
        }
        // unloaded for a second: the buffet has stopped, the flow is back
        if (!Double.isNaN(unloadedSinceS) && s.timeS - unloadedSinceS > 1.0) {
            phase = Phase.PULL_OUT;
            loops.relaxAlphaLimits();
            loops.alphaCapRad = Math.min(loops.alphaCapRad, envelope.alphaMaxLiftRad() - 2.0 * DEG);
        }
    }

    private void pullOut(SensedState s, double dtS) {
        loops.throttleHold(1.0);
        double nz = Loops.clamp(loops.nzForGamma(s, 2.0 * DEG), 0.5, Math.min(2.0, limits.nzMax - 0.5));
        loops.pitchNz(s, nz, dtS);
        loops.rollToBank(s, 0.0, 40 * DEG, dtS);
        loops.yawBeta(s, 0.0, dtS);
        if (s.gammaRad >= 0.0 || s.timeS - breakS > 30.0) {
            mark("recovered", s);
            hpSettle = s.hpM;
            headingRad = s.psiRad;
            phase = Phase.SETTLE;
            loops.relaxAlphaLimits();
        }
    }
}
