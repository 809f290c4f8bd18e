package org.pointcall.models.train;

import java.nio.file.Path;
import java.util.Map;
import java.util.Objects;

import org.pointcall.shared.error.InputRejectedException;
import org.pointcall.shared.yaml.YamlDoc;

/**
 * Everything a training run is told: which classifier, how the training rows are balanced, how many folds by
 * sortie, an optional held-out set, the seed of every random choice, and each classifier's settings (all four are
 * kept, so that one file also drives a {@link Comparison}). Read from the training config (YAML, described in the
 * models README); immutable, with {@code withX} copies.
 *
 * @param classifier the classifier a run trains
 * @param balance    how the training side is balanced
 * @param folds      folds of the cross-validation by sortie, at least 2
 * @param holdOut    the held-out sorties, possibly none
 * @param seed       seed of every random choice
 * @param features   what the classifiers are fitted on: the extractor's features as they are or relative ones
 */
public record TrainerSettings(ClassifierKind classifier, BalanceSettings balance, int folds,
                              HoldOutSettings holdOut, long seed, ForestSettings forest, BoostingSettings boosting,
                              LogisticSettings logistic, SvmSettings svm, FeatureForm features) {
    /** Name of the default config resource, beside this class. */
    public static final String DEFAULT_RESOURCE = "training-default.yaml";

    public TrainerSettings {
        Objects.requireNonNull(classifier, "classifier");
        Objects.requireNonNull(balance, "balance");
        Objects.requireNonNull(holdOut, "holdOut");
        Objects.requireNonNull(forest, "forest");
        Objects.requireNonNull(boosting, "boosting");
        Objects.requireNonNull(logistic, "logistic");
        Objects.requireNonNull(svm, "svm");
        Objects.requireNonNull(features, "features");
        TreeChecks.atLeast("folds", folds, 2);
        if (!balance.supports(classifier)) {
            throw new IllegalArgumentException("balance " + balance.method().key() + " is for the forest only, not "
                    + classifier.key());
        }
    }

    /** The shipped default config ({@value #DEFAULT_RESOURCE}), read once. */
    public static TrainerSettings defaults() {
        return SettingsReader.defaults();
    }

    /**
     * Reads a training config file (UTF-8). Keys left out take the shipped default's values.
     *
     * @throws InputRejectedException with every problem, one line each as {@code file:line:column: what}
     */
    public static TrainerSettings load(Path file) {
        return parse(YamlDoc.readFile(file), file.toString());
    }

    /** Reads training config text; problems name {@code sourceName}. */
    public static TrainerSettings parse(String text, String sourceName) {
        return new SettingsReader(new YamlDoc(sourceName)).read(text);
    }

    public TrainerSettings withClassifier(ClassifierKind k) {
        return new TrainerSettings(k, balance, folds, holdOut, seed, forest, boosting, logistic, svm, features);
    }

    public TrainerSettings withBalance(BalanceSettings b) {
        return new TrainerSettings(classifier, b, folds, holdOut, seed, forest, boosting, logistic, svm, features);
    }

    public TrainerSettings withFolds(int k) {
        return new TrainerSettings(classifier, balance, k, holdOut, seed, forest, boosting, logistic, svm, features);
    }

    public TrainerSettings withHoldOut(HoldOutSettings h) {
        return new TrainerSettings(classifier, balance, folds, h, seed, forest, boosting, logistic, svm, features);
    }

    public TrainerSettings withSeed(long s) {
        return new TrainerSettings(classifier, balance, folds, holdOut, s, forest, boosting, logistic, svm, features);
    }

    public TrainerSettings withForest(ForestSettings f) {
        return new TrainerSettings(classifier, balance, folds, holdOut, seed, f, boosting, logistic, svm, features);
    }

    public TrainerSettings withBoosting(BoostingSettings b) {
        return new TrainerSettings(classifier, balance, folds, holdOut, seed, forest, b, logistic, svm, features);
    }

    public TrainerSettings withLogistic(LogisticSettings l) {
        return new TrainerSettings(classifier, balance, folds, holdOut, seed, forest, boosting, l, svm, features);
    }

    public TrainerSettings withSvm(SvmSettings s) {
        return new TrainerSettings(classifier, balance, folds, holdOut, seed, forest, boosting, logistic, s, features);
    }

    public TrainerSettings withFeatures(FeatureForm f) {
        return new TrainerSettings(classifier, balance, folds, holdOut, seed, forest, boosting, logistic, svm, f);
    }

    /** The chosen classifier's settings by config key. */
    public Map<String, String> classifierSettings() {
        return settingsOf(classifier);
    }

    public Map<String, String> settingsOf(ClassifierKind k) {
        return switch (k) {
            case FOREST -> forest.asMap();
            case BOOSTING -> boosting.asMap();
            case LOGISTIC -> logistic.asMap();
            case SVM -> svm.asMap();
        };
    }
}
