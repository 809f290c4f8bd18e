package org.pointcall.ui.desk;

import java.util.Objects;

/** What the engineer asks of the session or the replay; the console only forwards these. */
public sealed interface DeskCommand {
    /** Arm a point: the next detection of its kind binds to it. */
    record Arm(String pointId) implements DeskCommand {
        public Arm {
            Objects.requireNonNull(pointId, "pointId");
        }
    }

    /** The engineer's own call on a point, with a note (may be empty). */
    record Call(String pointId, Outcome outcome, String note) implements DeskCommand {
        public Call {
            Objects.requireNonNull(pointId, "pointId");
            Objects.requireNonNull(outcome, "outcome");
            if (outcome == Outcome.INCOMPLETE) {
                throw new IllegalArgumentException("the engineer calls good or repeat");
            }
            note = note == null ? "" : note.strip();
        }
    }

    /** The engineer has seen the verdict of a point. */
    record AcknowledgeVerdict(String pointId) implements DeskCommand {
        public AcknowledgeVerdict {
            Objects.requireNonNull(pointId, "pointId");
        }
    }

    /** The engineer has seen a safety alarm. */
    record AcknowledgeAlarm(long alarmId) implements DeskCommand {
    }

    /** Replay: play or pause. */
    record PlayPause(boolean play) implements DeskCommand {
    }

    /** Replay: data time per wall time. */
    record Speed(double speed) implements DeskCommand {
        public Speed {
            if (!(speed > 0) || Double.isInfinite(speed)) {
                throw new IllegalArgumentException("replay speed must be positive and finite");
            }
        }
    }

    /** Replay: go to a data time, seconds from the start. */
    record Seek(double positionS) implements DeskCommand {
    }

    /** Replay: go to the beginning of a point. */
    record JumpToPoint(String pointId) implements DeskCommand {
        public JumpToPoint {
            Objects.requireNonNull(pointId, "pointId");
        }
    }
}
