/**
 * Class imbalance: flight-test data hold far more transit than test point (a sortie of twenty stalls gives over
 * twenty {@code none} rows per stall row), so training data are balanced by random
 * {@link org.pointcall.models.balance.Undersampling undersampling} of the majority class,
 * {@link org.pointcall.models.balance.Smote SMOTE} oversampling of the minority classes, or
 * {@link org.pointcall.models.balance.ClassWeights class weights}. Every random choice is seeded. Balance only the
 * training side of a split by sortie; never evaluate on balanced or synthetic rows.
 */
package org.pointcall.models.balance;
