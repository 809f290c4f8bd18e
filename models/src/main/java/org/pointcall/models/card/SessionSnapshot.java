package org.pointcall.models.card;

import java.util.List;

import org.pointcall.shared.outcome.BandStatus;
import org.pointcall.shared.outcome.LimitAlarm;
import org.pointcall.shared.outcome.Reason;
import org.pointcall.shared.outcome.Verdict;

/**
 * What a console shows, as of one instant of data time: immutable, published by the session thread, read by any
 * thread at its own pace ({@link CardSession#snapshot()}).
 *
 * @param timeNs       data time of the last frame taken
 * @param sortie       the card's sortie id, or empty
 * @param points       every card point in card order (empty without a card)
 * @param active       the point being flown, or null
 * @param recentAlarms the last {@link CardSession#RECENT_ALARMS} alarm changes, oldest first
 * @param limitsBroken limits broken right now ({@code Nz at most 6 g})
 * @param notices      the last few plain messages (a command that could not be applied, and why)
 * @param frames       frames taken
 * @param ticks        decision ticks
 * @param unplanned    unplanned manoeuvres so far
 */
public record SessionSnapshot(long timeNs, String sortie, List<CardPointView> points, ActivePoint active,
                              List<LimitAlarm> recentAlarms, List<String> limitsBroken, List<String> notices,
                              long frames, long ticks, int unplanned) {
    public SessionSnapshot {
        points = List.copyOf(points);
        recentAlarms = List.copyOf(recentAlarms);
        limitsBroken = List.copyOf(limitsBroken);
        notices = List.copyOf(notices);
    }

    /**
     * One card point's line.
     *
     * @param toolVerdict  the tool's verdict on its latest flight, or null
     * @param engineerCall the engineer's call on it, or null
     * @param reasons      the latest flight's reasons
     */
    public record CardPointView(String id, String kind, String title, CardPointState state, Verdict toolVerdict,
                                Verdict engineerCall, List<Reason> reasons) {
        public CardPointView {
            reasons = List.copyOf(reasons);
        }
    }

    /**
     * The point being flown.
     *
     * @param cardId null when it matched no card point (unplanned) or there is no card
     * @param gauges one per band of the card point, in card order
     * @param awaiting null once the detector has the point; while a point begun from the card's onset waits for the
     *                 detector, what it was begun from ({@code CardSession.ONSET_EVIDENCE}), for the console
     */
    public record ActivePoint(long detection, String cardId, String kind, String title, long beginNs,
                              List<Gauge> gauges, String awaiting) {
        public ActivePoint {
            gauges = List.copyOf(gauges);
        }

        /** A point the detector has. */
        public ActivePoint(long detection, String cardId, String kind, String title, long beginNs,
                           List<Gauge> gauges) {
            this(detection, cardId, kind, title, beginNs, gauges, null);
        }
    }

    /**
     * A live band.
     *
     * @param value          current value in the band's unit (entry: the entry value; rate: the slope over the
     *                       band's interval up to now), NaN before there is one
     * @param marginFraction signed margin to the nearer edge as a fraction of the band's width, NaN without a value
     * @param status         {@link BandStatus#WAITING} for instant and result bands until the point ends
     * @param outsideS       time spent outside so far, s
     */
    public record Gauge(int index, String subject, String phase, String unit, String band, double value,
                        double marginFraction, BandStatus status, double outsideS) {
    }
}
