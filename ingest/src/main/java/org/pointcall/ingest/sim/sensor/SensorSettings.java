package org.pointcall.ingest.sim.sensor;

/**
 * Stream-wide imperfections of a simulated telemetry link.
 *
 * @param clean            no noise, bias, lag, quantisation, wild points, dropouts or jitter at all
 * @param dropoutsPerHour  expected telemetry dropouts (runs of missing frames) per hour
 * @param dropoutMeanS     mean length of a dropout, s (exponentially distributed)
 * @param timeJitterStdS   standard deviation of the frame time stamps' jitter, s (kept monotonic)
 * @param scale            multiplies every sensor's noise (1 = the defaults)
 */
public record SensorSettings(boolean clean, double dropoutsPerHour, double dropoutMeanS, double timeJitterStdS,
                             double scale) {
    /** A link of the usual quality for a test range (values invented for the demo, common practice in kind). */
    public static final SensorSettings DEFAULT = new SensorSettings(false, 12, 0.4, 0.0005, 1.0);
    public static final SensorSettings CLEAN = new SensorSettings(true, 0, 0.4, 0, 0);

    public SensorSettings {
        if (!(dropoutsPerHour >= 0) || !(dropoutMeanS > 0) || !(timeJitterStdS >= 0) || !(scale >= 0)) {
            throw new IllegalArgumentException("dropout rate, jitter and scale must be >= 0, dropout length > 0");
        }
    }
}
