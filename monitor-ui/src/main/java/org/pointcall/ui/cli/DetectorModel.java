package org.pointcall.ui.cli;

import java.io.IOException;
import java.io.InputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;

import org.pointcall.models.modelfile.LoadedModel;
import org.pointcall.models.modelfile.ModelFiles;
import org.pointcall.models.train.Classifier;
import org.pointcall.shared.error.PointcallException;

/** The detector model a command runs: the user's file, or the default one shipped in the jar. */
final class DetectorModel {
    /** Classpath location of the default model. */
    static final String DEFAULT_RESOURCE = "/org/pointcall/ui/models/default.pcm";

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
        try (InputStream in = DetectorModel.class.getResourceAsStream(DEFAULT_RESOURCE)) {
            if (in == null) {
                throw new PointcallException("this build carries no default model; give --model MODEL");
            }
            // the model reader checks a file's lengths and hash; the resource goes through the same check
            Path tmp = Files.createTempFile("pointcall-default-", ".pcm");
            try {
                Files.copy(in, tmp, StandardCopyOption.REPLACE_EXISTING);
                return ModelFiles.load(tmp, Classifier.class);
            } finally {
                Files.deleteIfExists(tmp);
            }
        } catch (IOException e) {
            throw new PointcallException("cannot read the default model: " + e.getMessage(), e);
        }
    }
}
