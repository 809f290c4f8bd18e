/**
 * Training and comparison of the classifiers that give class probabilities per decision tick: a
 * {@link org.pointcall.models.train.Classifier} of ours over each Smile model (random forest, gradient tree
 * boosting, multinomial logistic regression, RBF SVM one against the rest), trained by a
 * {@link org.pointcall.models.train.Trainer} from {@link org.pointcall.models.train.TrainerSettings} (the training
 * config file), cross-validated by sortie with balancing on the training side only, and compared side by side by a
 * {@link org.pointcall.models.train.Comparison}.
 */
package org.pointcall.models.train;
