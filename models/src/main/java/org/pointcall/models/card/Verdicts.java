package org.pointcall.models.card;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

import org.pointcall.shared.outcome.LimitAlarm;
import org.pointcall.shared.outcome.Numbers;
import org.pointcall.shared.outcome.Reason;

/**
 * The rules that turn a point's band results into a verdict: GOOD when every band held in its phase and the point
 * was completed; REPEAT with one reason per band that did not hold and per safety limit broken during the point;
 * INCOMPLETE when the point was abandoned. (The session applies them; the limit part is here.)
 */
public final class Verdicts {
    private Verdicts() {
    }

    /**
     * One reason per exceedance that overlaps {@code [beginNs, endNs]}: raised before the end and not cleared
     * before the begin.
     */
    public static List<Reason> limitReasons(List<LimitAlarm> alarms, long beginNs, long endNs) {
        Map<String, LimitAlarm> open = new HashMap<>();
        List<Reason> out = new ArrayList<>();
        for (LimitAlarm a : alarms) {
            String key = a.parameter() + " " + a.limit();
            if (a.raised()) {
                open.put(key, a);
                continue;
            }
            LimitAlarm up = open.remove(key);
            if (up != null && up.timeNs() <= endNs && a.timeNs() >= beginNs) {
                out.add(reason(up, a.peak()));
            }
        }
        for (LimitAlarm up : open.values()) {
            if (up.timeNs() <= endNs) {
                out.add(reason(up, up.peak()));
            }
        }
        return out;
    }

    private static Reason reason(LimitAlarm up, double peak) {
        String u = up.unit().equals("1") ? "" : " " + up.unit();
        return new Reason("limit:" + up.parameter(), "safety limit broken: " + up.parameter() + " reached "
                + Numbers.near(peak, 3) + u + ", limit " + up.limit() + " (from "
                + String.format(java.util.Locale.ROOT, "%.1f", up.timeNs() / 1e9) + " s)");
    }
}
