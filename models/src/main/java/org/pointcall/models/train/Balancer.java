package org.pointcall.models.train;

import org.pointcall.models.balance.Smote;
import org.pointcall.models.balance.SmoteSettings;
import org.pointcall.models.balance.Undersampling;
import org.pointcall.models.data.LabelledRows;

/**
 * Applies a {@link BalanceSettings} to training rows, through the balancers of
 * {@link org.pointcall.models.balance}. Class weights change no row: the forest takes them when it is fitted.
 * Call it on the training side of a split only.
 */
public final class Balancer {
    private Balancer() {
    }

    /** The rows to fit on. */
    public static LabelledRows apply(LabelledRows training, BalanceSettings b, long seed) {
        return switch (b.method()) {
            case NONE, CLASS_WEIGHTS -> training;
            case UNDERSAMPLE -> Undersampling.apply(training, b.ratio(), seed);
            case SMOTE -> Smote.toRatio(training, b.ratio(),
                    SmoteSettings.withSeed(seed).withK(b.neighbours()).withDistance(b.distance()));
        };
    }
}
