package org.pointcall.models.balance;

/** How SMOTE measures which minority samples are nearest. */
public enum NeighbourDistance {
    /** Euclidean distance on the features as they are, as the published method does. */
    EUCLIDEAN,
    /**
     * Euclidean distance on features divided by their standard deviation over the minority class (a feature constant
     * over the class is left out of the distance), so that a feature in feet does not outweigh one in g. Only the
     * choice of neighbours changes; synthetic samples are still made in the original units.
     */
    STANDARDISED
}
