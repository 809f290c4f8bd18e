package org.pointcall.ingest.sim.sensor;

/**
 * How one simulated transducer and its channel spoil the true value, in the parameter's own unit.
 *
 * @param noiseStd   standard deviation of white Gaussian noise
 * @param bias       constant offset
 * @param quantum    least significant bit of the channel (0 for none)
 * @param lagS       time constant of a first-order lag (0 for none): probes, vanes and pneumatic lines lag
 * @param wildPerHour expected wild points (a single absurd sample) per hour of this parameter's samples
 */
public record SensorSpec(double noiseStd, double bias, double quantum, double lagS, double wildPerHour) {
    public static final SensorSpec CLEAN = new SensorSpec(0, 0, 0, 0, 0);

    public SensorSpec {
        if (!(noiseStd >= 0) || !(quantum >= 0) || !(lagS >= 0) || !(wildPerHour >= 0) || !Double.isFinite(bias)) {
            throw new IllegalArgumentException("sensor noise, quantum, lag and wild-point rate must be >= 0, bias finite");
        }
    }
}
