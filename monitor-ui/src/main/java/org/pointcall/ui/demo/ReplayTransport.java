package org.pointcall.ui.demo;

import java.util.function.Function;

import org.pointcall.replay.play.ReplayControl;
import org.pointcall.replay.play.ReplayState;
import org.pointcall.ui.desk.DeskCommand;
import org.pointcall.ui.desk.TransportState;

/**
 * The console's transport buttons on a replay's {@link ReplayControl}: play, pause, speed, seek, and jump to a
 * point (a seek to a little before where the point began). Positions are seconds from the recording's start.
 */
public final class ReplayTransport implements SessionDesk.TransportSide {
    /** A jump lands this long before the point begins, so that its entry is seen. */
    public static final double JUMP_LEAD_S = 5.0;

    private final ReplayControl control;
    private final long startNs;
    private final double lengthS;
    private final Function<String, Double> pointBeginS;

    /**
     * @param startNs     data time of the recording's first packet
     * @param lengthS     length of the recording, s
     * @param pointBeginS archive time (s, the packets' clock) at which a point began, or null when not known
     */
    public ReplayTransport(ReplayControl control, long startNs, double lengthS, Function<String, Double> pointBeginS) {
        this.control = control;
        this.startNs = startNs;
        this.lengthS = lengthS;
        this.pointBeginS = pointBeginS;
    }

    @Override
    public TransportState state() {
        long p = control.positionNs();
        double pos = p == Long.MIN_VALUE ? 0 : Math.max(0, (p - startNs) / 1e9);
        double speed = Double.isInfinite(control.speed()) ? ReplayControl.MAX_PACED : control.speed();
        return new TransportState(control.state() == ReplayState.PLAYING, speed, Math.min(pos, lengthS), lengthS);
    }

    @Override
    public void accept(DeskCommand c) {
        if (c instanceof DeskCommand.PlayPause p) {
            if (p.play()) {
                control.play();
            } else {
                control.pause();
            }
        } else if (c instanceof DeskCommand.Speed s) {
            control.speed(Math.max(ReplayControl.MIN_PACED, Math.min(ReplayControl.MAX_PACED, s.speed())));
        } else if (c instanceof DeskCommand.Seek s) {
            control.seek(startNs + Math.round(Math.max(0, Math.min(lengthS, s.positionS())) * 1e9));
        } else if (c instanceof DeskCommand.JumpToPoint j) {
            Double begin = pointBeginS.apply(j.pointId());
            if (begin == null) {
                throw new IllegalArgumentException("point " + j.pointId() + " has not been seen in this replay yet");
            }
            control.seek(Math.max(startNs, Math.round((begin - JUMP_LEAD_S) * 1e9)));
        }
    }
}
