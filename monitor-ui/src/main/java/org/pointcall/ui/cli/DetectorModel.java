package org.pointcall.ui.cli;

import java.nio.file.Files;
import java.nio.file.Path;

import org.pointcall.models.modelfile.LoadedModel;
import org.pointcall.models.modelfile.ModelFiles;
import org.pointcall.models.train.Classifier;
import org.pointcall.shared.error.PointcallException;

/** The detector model a command runs: the user's file, or the default one shipped in the jar. */
final class DetectorModel {
    private DetectorModel() {
    }

    /** {@code file}, or the default model when it is null. */
    static LoadedModel<Classifier> load(Path file) {
        if (file != null) {
            if (!Files.isRegularFile(file)) {
                throw new PointcallException(file + ": no such model file");
            }
            return ModelFiles.load(file, Classifier.class);
        }
        return ShippedModel.load();
    }
}
