package org.pointcall.models.train;

import smile.data.DataFrame;
import smile.data.formula.Formula;
import smile.data.vector.IntVector;

/**
 * Smile data frames of training rows. Columns are named {@code f0..f<d-1>} and the response {@code class}, so that
 * no feature name (they hold dots) can clash with Smile's formula syntax or the response; our own names stay in
 * the classifier.
 */
final class SmileFrames {
    static final String RESPONSE = "class";
    static final Formula FORMULA = Formula.lhs(RESPONSE);

    private SmileFrames() {
    }

    static DataFrame of(double[][] x, int[] y) {
        int d = x.length == 0 ? 0 : x[0].length;
        String[] names = new String[d];
        for (int f = 0; f < d; f++) {
            names[f] = "f" + f;
        }
        return DataFrame.of(x, names).merge(IntVector.of(RESPONSE, y));
    }
}
