package org.pointcall.ui.desk;

/**
 * Where a replay stands.
 *
 * @param playing   running (not paused)
 * @param speed     data time per wall time
 * @param positionS data time now, seconds from the start of the recording
 * @param lengthS   length of the recording, seconds
 */
public record TransportState(boolean playing, double speed, double positionS, double lengthS) {
    public TransportState {
        if (!(speed > 0) || !(lengthS >= 0)) {
            throw new IllegalArgumentException("replay speed must be > 0 and length >= 0");
        }
    }
}
