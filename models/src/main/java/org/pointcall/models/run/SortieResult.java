package org.pointcall.models.run;

import java.util.List;
import java.util.Objects;

import org.pointcall.models.metrics.DetectedPoint;
import org.pointcall.models.metrics.TruePoint;

/**
 * One recording run through a model as live.
 *
 * @param name            the sortie's name
 * @param airframe        its airframe, or empty
 * @param truth           the labelled points
 * @param detected        the points the detector kept (ENDED), begin and end as finally given, reported at BEGUN
 * @param discarded       points begun and then discarded by minimum duration or guard rules
 * @param truthClass      per decision tick, the labelled class ({@code LabelledRows.CLASS_NAMES} index)
 * @param predictedClass  per decision tick, the classifier's most probable class
 * @param spanBeginS      first frame, s of the recording's time line
 * @param spanEndS        last frame, s
 * @param classifierNs    time spent in the classifier over all ticks, ns (wall clock of this thread)
 * @param detectorNs      time spent in the point detector (its physics per frame, its decisions per tick and the
 *                        boundary rules), ns, the same way
 * @param framesRead      frames the reader delivered
 * @param rowsSkipped     rows of the recording the reader skipped
 */
public record SortieResult(String name, String airframe, List<TruePoint> truth, List<DetectedPoint> detected,
                           int discarded, int[] truthClass, int[] predictedClass, double spanBeginS, double spanEndS,
                           long classifierNs, long detectorNs, long framesRead, long rowsSkipped) {
    public SortieResult {
        Objects.requireNonNull(name, "name");
        airframe = airframe == null ? "" : airframe;
        truth = List.copyOf(truth);
        detected = List.copyOf(detected);
        if (truthClass.length != predictedClass.length) {
            throw new IllegalArgumentException(truthClass.length + " labelled ticks but " + predictedClass.length
                    + " predicted");
        }
        if (!(spanEndS >= spanBeginS)) {
            throw new IllegalArgumentException("span end before begin");
        }
    }

    /** Decision ticks classified. */
    public int ticks() {
        return predictedClass.length;
    }
}
