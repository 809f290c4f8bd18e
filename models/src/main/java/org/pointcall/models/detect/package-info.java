/**
 * The streaming point detector: per-tick class probabilities plus the physics of the frames become
 * {@link org.pointcall.models.detect.PointEvent point events} (BEGUN, REFINED, ENDED, DISCARDED), live.
 *
 * <p>Parts, each usable and testable alone: a {@link org.pointcall.models.detect.Smoother} (exponential, moving
 * average or none); one {@link org.pointcall.models.detect.Hysteresis} per kind on the smoothed probability (enter
 * above p_on for t_on, leave below p_off for t_off) and one on the raw probability at the lower edge threshold,
 * debounced, which places begin and end; {@link org.pointcall.models.detect.GuardRule guard rules}, named and
 * individually switchable ({@link org.pointcall.models.detect.GuardRules}); a
 * {@link org.pointcall.models.detect.StateBinder} that fills the {@link org.pointcall.models.detect.PhysicalState}
 * from frames; {@link org.pointcall.models.detect.BoundaryRules boundary rules}, named and switchable the same way,
 * that place a found point's begin and end from the physics (where the aircraft left its steady entry, where it was
 * back in steady flight, the whole gain of a level acceleration, the whole hold of a stabilised point).
 * One boundary rule finds points without the classifier: {@code doublet-signature}
 * ({@code DoubletWatch}), a pitch doublet seen in the pitch rate alone.
 * {@link org.pointcall.models.detect.PointDetector} arbitrates: one open point at a time, takeover by
 * another kind (a {@link org.pointcall.models.detect.KindSwitch} keeps it one point), gaps merged, minimum
 * durations, rules judged at the end. {@link org.pointcall.models.detect.DetectorSettings} holds every threshold.
 *
 * <p>Per tick: smooth; update each kind's two switches; restart a kind's rules when its raw probability starts a
 * new rise (so rules see a manoeuvre from its start, before it is entered); mark rules at ticks whose raw
 * probability is above the edge (so the final judgement excludes frames after the end); then decide: begin the
 * strongest entered kind, confirm live, leave, merge, take over or end.
 *
 * <p>Threads: single-threaded on the stream's pipeline thread; nothing is allocated per tick or frame except when an
 * event is emitted. Events are immutable.
 */
package org.pointcall.models.detect;
