package org.pointcall.ui.desk;

/**
 * Where a replay stands.
 *
 * @param playing   running (not paused)
 * @param speed     data time per wall time
 * @param positionS data time now, seconds from the start of the recording
 * @param lengthS   length of the recording, seconds
 * @param catchUpToS where a jump is being caught up to (everything before it played as fast as it goes), seconds
 *                   from the start; NaN when none is
 */
public record TransportState(boolean playing, double speed, double positionS, double lengthS, double catchUpToS) {
    public TransportState {
        if (!(speed > 0) || !(lengthS >= 0)) {
            throw new IllegalArgumentException("replay speed must be > 0 and length >= 0");
        }
    }
}
