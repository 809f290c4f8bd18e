package org.pointcall.models.data;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Set;

import org.pointcall.ingest.derive.DerivedParameters;
import org.pointcall.ingest.file.ReadOptions;
import org.pointcall.ingest.file.ReadReport;
import org.pointcall.ingest.file.RecordedFileSource;
import org.pointcall.ingest.file.RecordedFiles;
import org.pointcall.ingest.sim.truth.SortieTruth;
import org.pointcall.ingest.window.FeatureExtractor;
import org.pointcall.ingest.window.FeatureListener;
import org.pointcall.models.label.Labels;
import org.pointcall.shared.dictionary.ParameterDictionary;
import org.pointcall.shared.error.PointcallException;
import org.pointcall.shared.units.Units;

/**
 * Builds {@link LabelledRows} from recorded sorties: each recording is read through the dictionary, its derived
 * parameters computed and its features extracted exactly as the live pipeline does (read, derive, windows), and
 * every decision tick is labelled with the class of the label interval containing it ({@code none} outside them).
 *
 * <p>Ticks with a NaN feature are dropped (or kept, see {@link IncompleteRows}); ticks within the boundary margin
 * of a label's begin or end are dropped as ambiguous. Every dropped tick is counted in the sortie's
 * {@link SortieReport}. Single-threaded; one builder per data set.
 */
public final class DatasetBuilder {
    /** File names of a simulated sortie's directory. */
    public static final String SIM_RECORDING = "sortie.csv";
    public static final String SIM_TRUTH = "truth.json";

    private final ParameterDictionary dictionary;
    private final DatasetSettings settings;
    private final List<String> featureNames;
    private final List<LabelledRows> parts = new ArrayList<>();
    private final List<SortieReport> reports = new ArrayList<>();
    private final Set<String> names = new HashSet<>();

    private DatasetBuilder(ParameterDictionary dictionary, DatasetSettings settings) {
        this.dictionary = dictionary;
        this.settings = settings;
        // binding once checks the windows against the dictionary before any file is read
        this.featureNames = FeatureExtractor.bind(dictionary, settings.windows(), settings.extractor(),
                (t, f, v, c) -> { }).layout().names();
    }

    /**
     * @throws PointcallException when a window names a parameter the dictionary lacks
     */
    public static DatasetBuilder create(ParameterDictionary dictionary, DatasetSettings settings) {
        return new DatasetBuilder(Objects.requireNonNull(dictionary, "dictionary"),
                Objects.requireNonNull(settings, "settings"));
    }

    public List<String> featureNames() {
        return featureNames;
    }

    public DatasetSettings settings() {
        return settings;
    }

    /** {@link #addRecording(Path, ReadOptions, Labels, SortieInfo)} with the default read options. */
    public SortieReport addRecording(Path recording, Labels labels, SortieInfo sortie) {
        return addRecording(recording, ReadOptions.DEFAULTS, labels, sortie);
    }

    /**
     * Reads one recorded sortie and labels its ticks.
     *
     * @throws org.pointcall.shared.error.InputRejectedException when the recording is refused
     * @throws PointcallException when the sortie's name is already in the set, or the labels' times cannot be on
     *                            the recording's time line (seconds against a time of day)
     */
    public SortieReport addRecording(Path recording, ReadOptions options, Labels labels, SortieInfo sortie) {
        Objects.requireNonNull(labels, "labels");
        if (names.contains(sortie.name())) {
            throw new PointcallException("sortie '" + sortie.name() + "' is already in the data set");
        }
        Collector collector = new Collector(featureNames.size(), settings.incompleteRows() == IncompleteRows.KEEP);
        FeatureExtractor extractor = FeatureExtractor.bind(dictionary, settings.windows(), settings.extractor(),
                collector);
        DerivedParameters derived = DerivedParameters.bind(dictionary);
        ReadReport read;
        try (RecordedFileSource source = RecordedFiles.open(recording, dictionary, options)) {
            read = source.readAll(frame -> {
                derived.apply(frame);
                extractor.onFrame(frame);
            });
        }
        String recordingName = read.source();
        Labels aligned = read.framesDelivered() == 0 || read.timeForm() == null ? labels
                : labels.alignedTo(read.firstTimeNs(), read.timeForm(), recordingName);
        long marginNs = Units.secondsToNs(settings.boundaryMarginS());

        LabelledRows.Builder rows = LabelledRows.builder(featureNames, List.of(sortie));
        int d = featureNames.size();
        int[] perInterval = new int[aligned.size()];
        long nearBoundary = 0;
        double[] row = new double[d];
        for (int i = 0; i < collector.n; i++) {
            long t = collector.timeNs[i];
            if (marginNs > 0 && aligned.distanceToBoundaryNs(t) < marginNs) {
                nearBoundary++;
                continue;
            }
            int interval = aligned.indexAt(t);
            int cls = interval < 0 ? 0 : LabelledRows.classIndex(aligned.interval(interval).kind());
            if (interval >= 0) {
                perInterval[interval]++;
            }
            System.arraycopy(collector.values, i * d, row, 0, d);
            rows.add(row, cls, t, 0, false);
        }
        LabelledRows part = rows.build();
        List<String> empty = new ArrayList<>();
        for (int k = 0; k < perInterval.length; k++) {
            if (perInterval[k] == 0) {
                empty.add(aligned.describe(k));
            }
        }
        Map<String, Integer> perClass = new LinkedHashMap<>(part.rowsPerClass());
        SortieReport report = new SortieReport(sortie, read, collector.ticks, part.rows(), collector.incomplete,
                nearBoundary, perClass, empty);
        names.add(sortie.name());
        parts.add(part);
        reports.add(report);
        return report;
    }

    /**
     * Adds a simulated sortie from its directory: {@value #SIM_RECORDING} labelled by the points of
     * {@value #SIM_TRUTH}. The sortie is named and its airframe taken from the truth file.
     */
    public SortieReport addSimulated(Path sortieDir) {
        Path truthFile = sortieDir.resolve(SIM_TRUTH);
        Path recording = sortieDir.resolve(SIM_RECORDING);
        if (!Files.isRegularFile(truthFile) || !Files.isRegularFile(recording)) {
            throw new PointcallException(sortieDir + ": a simulated sortie's directory holds " + SIM_RECORDING
                    + " and " + SIM_TRUTH + (Files.isRegularFile(truthFile) ? "; " + SIM_RECORDING + " is missing"
                    : "; " + SIM_TRUTH + " is missing"));
        }
        SortieTruth truth = SortieTruth.read(truthFile);
        Labels labels = Labels.fromTruth(truth);
        return addRecording(recording, labels, new SortieInfo(truth.sortie(), truth.airframe(),
                recording.toString(), truthFile.toString()));
    }

    public List<SortieReport> reports() {
        return List.copyOf(reports);
    }

    /** Every sortie added so far, in the order added. */
    public LabelledRows build() {
        if (parts.isEmpty()) {
            return LabelledRows.builder(featureNames, List.of()).build();
        }
        return LabelledRows.concat(parts);
    }

    /** Copies each tick's features into growing primitive arrays. */
    private static final class Collector implements FeatureListener {
        private final int d;
        private final boolean keepIncomplete;
        double[] values = new double[0];
        long[] timeNs = new long[0];
        int n;
        long ticks;
        long incomplete;

        Collector(int d, boolean keepIncomplete) {
            this.d = d;
            this.keepIncomplete = keepIncomplete;
            grow(1024);
        }

        private void grow(int rows) {
            values = Arrays.copyOf(values, rows * d);
            timeNs = Arrays.copyOf(timeNs, rows);
        }

        @Override
        public void onFeatures(long tNs, double[] features, boolean[] valid, double[] coverage) {
            ticks++;
            if (!keepIncomplete) {
                for (int k = 0; k < d; k++) {
                    if (Double.isNaN(features[k])) {
                        incomplete++;
                        return;
                    }
                }
            }
            if (n == timeNs.length) {
                grow(n + (n >> 1));
            }
            System.arraycopy(features, 0, values, n * d, d);
            timeNs[n] = tNs;
            n++;
        }
    }
}
