package org.pointcall.models.run;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Objects;

import org.pointcall.ingest.derive.DerivedParameters;
import org.pointcall.ingest.file.ReadOptions;
import org.pointcall.ingest.file.ReadReport;
import org.pointcall.ingest.file.RecordedFileSource;
import org.pointcall.ingest.file.RecordedFiles;
import org.pointcall.ingest.frame.Frame;
import org.pointcall.ingest.sim.truth.SortieTruth;
import org.pointcall.ingest.window.FeatureExtractor;
import org.pointcall.models.data.DatasetBuilder;
import org.pointcall.models.data.LabelledRows;
import org.pointcall.models.detect.ClassLayout;
import org.pointcall.models.detect.DetectorListener;
import org.pointcall.models.detect.DetectorSettings;
import org.pointcall.models.detect.PointDetector;
import org.pointcall.models.detect.PointEvent;
import org.pointcall.models.label.Labels;
import org.pointcall.models.metrics.DetectedPoint;
import org.pointcall.models.metrics.TruePoint;
import org.pointcall.models.modelfile.BoundParameter;
import org.pointcall.models.modelfile.ModelDescription;
import org.pointcall.models.train.Classifier;
import org.pointcall.shared.dictionary.ParameterDictionary;
import org.pointcall.shared.error.PointcallException;
import org.pointcall.shared.units.Units;

/**
 * Plays a recording through a trained model frame by frame, as the live pipeline would: every frame is derived
 * ({@link DerivedParameters}), fed to the model's windows ({@link FeatureExtractor}) and to the detector's physics;
 * at every decision tick the classifier's probabilities go to the {@link PointDetector}. What the detector keeps
 * becomes {@link DetectedPoint}s (reported at its BEGUN), and every tick's most probable class is kept beside the
 * labelled one for row-level scores.
 *
 * <p>Nothing looks ahead: a tick sees only the frames up to its instant, as live. Single-threaded; the classifier
 * is copied so that several scorers may share one model.
 */
public final class StreamingScorer {
    private final Classifier classifier;
    private final ModelDescription model;
    private final ParameterDictionary dictionary;
    private final DetectorSettings detectorSettings;
    private DetectorListener watcher;

    /**
     * @throws PointcallException when the dictionary lacks a parameter the model needs, carries one in a unit of
     *                            another dimension, or in another unit of the same dimension (features are not
     *                            converted here), or the classifier's features are not the model's
     */
    public StreamingScorer(Classifier classifier, ModelDescription model, ParameterDictionary dictionary,
                           DetectorSettings detectorSettings) {
        this.classifier = Objects.requireNonNull(classifier, "classifier").copy();
        this.model = Objects.requireNonNull(model, "model");
        this.dictionary = Objects.requireNonNull(dictionary, "dictionary");
        this.detectorSettings = Objects.requireNonNull(detectorSettings, "detectorSettings");
        if (!classifier.featureNames().equals(model.features())) {
            throw new PointcallException("the classifier's " + classifier.featureCount()
                    + " features are not the model description's " + model.features().size());
        }
        for (BoundParameter b : model.requirements().check(dictionary)) {
            if (b.needsConversion()) {
                throw new PointcallException("dictionary '" + dictionary.name() + "' carries " + b.name() + " in "
                        + b.sourceUnit().symbol() + ", the model was trained in " + b.modelUnit().symbol()
                        + "; converting features is not supported here");
            }
        }
    }

    /**
     * Also gives every detector event (BEGUN, REFINED, ENDED, DISCARDED) to {@code listener}, on the scoring thread,
     * for a closer look at how points were decided; null for none.
     */
    public StreamingScorer watchEvents(DetectorListener listener) {
        this.watcher = listener;
        return this;
    }

    /** A simulated sortie's folder: {@code sortie.csv} labelled by {@code truth.json}. */
    public SortieResult scoreSimulated(Path sortieDir) {
        Path truthFile = sortieDir.resolve(DatasetBuilder.SIM_TRUTH);
        Path recording = sortieDir.resolve(DatasetBuilder.SIM_RECORDING);
        if (!Files.isRegularFile(recording)) {
            throw new PointcallException(sortieDir + ": no " + DatasetBuilder.SIM_RECORDING + " in it");
        }
        if (!Files.isRegularFile(truthFile)) {
            throw new PointcallException(sortieDir + ": no " + DatasetBuilder.SIM_TRUTH + " in it");
        }
        SortieTruth truth = SortieTruth.read(truthFile);
        return score(recording, Labels.fromTruth(truth), sortieDir.toString(), truth.airframe());
    }

    /**
     * A recording labelled by {@code labels} (a label file's, or a truth's).
     *
     * @throws org.pointcall.shared.error.InputRejectedException when the recording is refused
     */
    public SortieResult score(Path recording, Labels labels, String name, String airframe) {
        Run run = new Run();
        ReadReport read;
        try (RecordedFileSource source = RecordedFiles.open(recording, dictionary, ReadOptions.DEFAULTS)) {
            read = source.readAll(run::onFrame);
        }
        if (run.frames == 0) {
            throw new PointcallException(recording + ": no frame could be read");
        }
        run.detector.finish(run.lastFrameNs);
        Labels aligned = read.timeForm() == null ? labels
                : labels.alignedTo(read.firstTimeNs(), read.timeForm(), read.source());
        int[] truthClass = new int[run.ticks];
        for (int i = 0; i < run.ticks; i++) {
            int k = aligned.indexAt(run.tickNs[i]);
            truthClass[i] = k < 0 ? 0 : LabelledRows.classIndex(aligned.interval(k).kind());
        }
        return new SortieResult(name, airframe, TruePoint.fromLabels(aligned), run.detected, run.discarded,
                truthClass, Arrays.copyOf(run.predicted, run.ticks), Units.nsToSeconds(run.firstFrameNs),
                Units.nsToSeconds(run.lastFrameNs), run.classifierNs, run.detectorNs, read.framesDelivered(), read.rowsSkipped());
    }

    /** One recording's pipeline and what it has produced so far. */
    private final class Run {
        final DerivedParameters derived = DerivedParameters.bind(dictionary);
        final FeatureExtractor extractor;
        final PointDetector detector;
        final double[] posterior = new double[LabelledRows.classCount()];
        final List<DetectedPoint> detected = new ArrayList<>();
        int discarded;
        long[] tickNs = new long[4096];
        int[] predicted = new int[4096];
        int ticks;
        long classifierNs;
        long detectorNs;
        long frames;
        long firstFrameNs;
        long lastFrameNs;
        long currentFrameNs;
        boolean pending;
        long pendingNs;

        Run() {
            extractor = FeatureExtractor.bind(dictionary, model.windows(), model.extractor(), this::onFeatures);
            detector = PointDetector.bind(dictionary, ClassLayout.standard(), detectorSettings, this::onEvent);
        }

        void onFrame(Frame f) {
            if (frames == 0) {
                firstFrameNs = f.timeNs();
                detector.init(f.timeNs());
            }
            frames++;
            lastFrameNs = f.timeNs();
            currentFrameNs = f.timeNs();
            derived.apply(f);
            extractor.onFrame(f);
            long t0 = System.nanoTime();
            detector.onFrame(f);
            // a tick at this frame's own instant fired inside the extractor; the detector gets it after the frame
            if (pending) {
                pending = false;
                detector.onTick(pendingNs, posterior);
            }
            detectorNs += System.nanoTime() - t0;
        }

        void onFeatures(long timeNs, double[] features, boolean[] valid, double[] coverage) {
            long t0 = System.nanoTime();
            int c = classifier.predict(features, posterior);
            classifierNs += System.nanoTime() - t0;
            if (ticks == tickNs.length) {
                tickNs = Arrays.copyOf(tickNs, ticks * 2);
                predicted = Arrays.copyOf(predicted, ticks * 2);
            }
            tickNs[ticks] = timeNs;
            predicted[ticks] = c;
            ticks++;
            if (timeNs >= currentFrameNs) {
                pending = true;
                pendingNs = timeNs;
            } else {
                long t1 = System.nanoTime();
                detector.onTick(timeNs, posterior);
                detectorNs += System.nanoTime() - t1;
            }
        }

        void onEvent(PointEvent e) {
            if (watcher != null) {
                watcher.onPointEvent(e);
            }
            switch (e.type()) {
                // begunAtNs is the BEGUN event's reportedAtNs: the live report of the point
                case ENDED -> detected.add(new DetectedPoint(e.kind(), Units.nsToSeconds(e.beginNs()),
                        Units.nsToSeconds(e.endNs()), Units.nsToSeconds(e.begunAtNs())));
                case DISCARDED -> discarded++;
                case BEGUN, REFINED -> { }
            }
        }
    }
}
