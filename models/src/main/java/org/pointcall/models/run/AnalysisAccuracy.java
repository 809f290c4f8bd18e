package org.pointcall.models.run;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.TreeMap;

import org.pointcall.ingest.derive.DerivedParameters;
import org.pointcall.ingest.file.ReadOptions;
import org.pointcall.ingest.file.RecordedFileSource;
import org.pointcall.ingest.file.RecordedFiles;
import org.pointcall.ingest.sim.airframe.Airframes;
import org.pointcall.ingest.sim.model.FlightModel;
import org.pointcall.ingest.sim.model.LongitudinalLinearModel;
import org.pointcall.ingest.sim.model.SimulationSettings;
import org.pointcall.ingest.sim.truth.PointTruth;
import org.pointcall.ingest.sim.truth.SortieTruth;
import org.pointcall.models.analysis.Analysers;
import org.pointcall.models.analysis.ManoeuvreResult;
import org.pointcall.models.analysis.PointHistory;
import org.pointcall.models.data.DatasetBuilder;
import org.pointcall.models.metrics.Percentiles;
import org.pointcall.shared.airdata.AirData;
import org.pointcall.shared.atmosphere.StandardAtmosphere;
import org.pointcall.shared.card.Band;
import org.pointcall.shared.card.BandPhase;
import org.pointcall.shared.card.CardFiles;
import org.pointcall.shared.card.TestCard;
import org.pointcall.shared.card.TestPoint;
import org.pointcall.shared.dictionary.ParameterDictionary;
import org.pointcall.shared.error.PointcallException;
import org.pointcall.shared.kind.ManoeuvreKind;
import org.pointcall.shared.kind.MetricSpec;
import org.pointcall.shared.units.Units;

/**
 * How close the manoeuvre analysers come to the simulator's truth: every truth point of simulated sorties is
 * analysed on the sortie's recorded (noisy) telemetry over its true interval, with no hint from the truth, and each
 * registry metric is compared with the truth's value from the exact trajectory. For pitch doublets the short-period
 * frequency and damping are also compared with the flight model's own linearisation at the point's entry
 * ({@link LongitudinalLinearModel}, its short-period eigenvalue).
 *
 * <p>Targets: short-period frequency and damping within 5 % (of the linearised values and of the truth's), stall
 * speed within 1 kt and altitude loss within 20 ft of the truth.
 */
public final class AnalysisAccuracy {
    /** Seconds of telemetry kept before a point's begin, for entry rates and filters. */
    public static final double PRE_ROLL_S = 15.0;

    /** Per kind and metric: the absolute errors, registry units, and the target (NaN: none; relative when rel). */
    private final Map<String, List<Double>> errors = new TreeMap<>();
    private final Map<String, Double> targets = new TreeMap<>();
    private final Map<String, Boolean> relative = new TreeMap<>();
    private final Map<String, List<Double>> relErrors = new TreeMap<>();
    private int points;
    private int sorties;
    private final List<String> problems = new ArrayList<>();
    private final List<String> details = new ArrayList<>();

    /** Runs the sortie folders given. */
    public static AnalysisAccuracy run(List<Path> sortieDirs, java.util.function.Function<Path, ParameterDictionary>
            dictionaries) {
        AnalysisAccuracy a = new AnalysisAccuracy();
        for (Path dir : sortieDirs) {
            a.sortie(dir, dictionaries.apply(dir));
        }
        return a;
    }

    private void sortie(Path dir, ParameterDictionary dictionary) {
        Path truthFile = dir.resolve(DatasetBuilder.SIM_TRUTH);
        Path recording = dir.resolve(DatasetBuilder.SIM_RECORDING);
        if (!Files.isRegularFile(truthFile) || !Files.isRegularFile(recording)) {
            throw new PointcallException(dir + ": needs " + DatasetBuilder.SIM_RECORDING + " and "
                    + DatasetBuilder.SIM_TRUTH);
        }
        SortieTruth truth = SortieTruth.read(truthFile);
        Path cardFile = dir.resolve("card.yaml");
        TestCard card = Files.isRegularFile(cardFile) ? CardFiles.load(cardFile, dictionary) : null;
        PointHistory history = PointHistory.ofAll(dictionary, 1 << 16);
        DerivedParameters derived = DerivedParameters.bind(dictionary);
        try (RecordedFileSource source = RecordedFiles.open(recording, dictionary, ReadOptions.DEFAULTS)) {
            source.readAll(f -> {
                derived.apply(f);
                history.append(f);
            });
        }
        sorties++;
        for (PointTruth p : truth.points()) {
            ManoeuvreKind kind = ManoeuvreKind.byKey(p.kind()).orElse(null);
            if (kind == null) {
                continue;
            }
            long b = Units.secondsToNs(p.beginS());
            long e = Units.secondsToNs(p.endS());
            PointHistory h = history.slice(b - Units.secondsToNs(PRE_ROLL_S), e);
            ManoeuvreResult r = Analysers.analyse(kind, h, b, e, Map.of(), intervals(card, p.cardId()));
            points++;
            for (MetricSpec ms : kind.metrics()) {
                Double t = p.metrics().get(ms.name());
                if (t == null || !Double.isFinite(t)) {
                    continue;
                }
                String key = kind.key() + "." + ms.name();
                if (r.metricSi(ms.name()).isEmpty()) {
                    add(key, Double.NaN, t);
                    problems.add(dir.getFileName() + " " + p.cardId() + ": " + ms.name() + " not computed "
                            + r.notes());
                    continue;
                }
                double v = ms.unit().fromSi(r.metricSi(ms.name()).getAsDouble());
                add(key, v, t);
                details.add(String.format(Locale.ROOT, "%s %s %s: analysed %.5g, truth %.5g, error %.3g",
                        dir.getFileName(), p.cardId(), ms.name(), v, t, v - t));
            }
            if (kind == ManoeuvreKind.PITCH_DOUBLET) {
                double[] sp = linearShortPeriod(truth.airframe(), p);
                if (sp != null) {
                    r.metricSi("sp-frequency").ifPresent(v -> add(kind.key() + ".sp-frequency-vs-linear", v, sp[0]));
                    r.metricSi("sp-damping").ifPresent(v -> add(kind.key() + ".sp-damping-vs-linear", v, sp[1]));
                    Double tf = p.metrics().get("sp-frequency");
                    Double tz = p.metrics().get("sp-damping");
                    if (tf != null) {
                        add(kind.key() + ".truth-sp-frequency-vs-linear", tf, sp[0]);
                    }
                    if (tz != null) {
                        add(kind.key() + ".truth-sp-damping-vs-linear", tz, sp[1]);
                    }
                }
            }
        }
    }

    private void add(String key, double value, double truth) {
        errors.computeIfAbsent(key, k -> new ArrayList<>()).add(Math.abs(value - truth));
        relErrors.computeIfAbsent(key, k -> new ArrayList<>()).add(Math.abs(value - truth) / Math.abs(truth));
        if (!targets.containsKey(key)) {
            String metric = key.substring(key.indexOf('.') + 1);
            double target = Double.NaN;
            boolean rel = false;
            if (metric.startsWith("sp-frequency") || metric.startsWith("sp-damping")) {
                target = 0.05;
                rel = true;
            } else if (metric.equals("stall-kcas")) {
                target = 1.0;
            } else if (metric.equals("altitude-loss")) {
                target = 20.0;
            }
            targets.put(key, target);
            relative.put(key, rel);
        }
    }

    /** Per band subject with a stated interval, that interval, from the card point the truth names. */
    private static Map<String, Double> intervals(TestCard card, String cardId) {
        Map<String, Double> out = new LinkedHashMap<>();
        if (card == null) {
            return out;
        }
        for (TestPoint tp : card.points()) {
            if (tp.id().equals(cardId)) {
                for (Band band : tp.bands()) {
                    if (band.phase() == BandPhase.RATE && Double.isFinite(band.overS())) {
                        out.put(band.subject(), band.overS());
                    }
                }
            }
        }
        return out;
    }

    /** {wn, zeta} of the flight model's short period linearised at the point's entry; null when it cannot trim. */
    static double[] linearShortPeriod(String airframe, PointTruth p) {
        try {
            FlightModel m = new FlightModel(Airframes.load(airframe), SimulationSettings.DEFAULT);
            double hp = Units.ftToM(p.entry().get("Hp"));
            double mach = AirData.machFromImpactPressure(AirData.impactPressureFromCas(Units.ktToMps(
                    p.entry().get("KCAS"))), StandardAtmosphere.pressurePa(hp));
            double tas = mach * StandardAtmosphere.speedOfSoundMps(hp);
            LongitudinalLinearModel lm = LongitudinalLinearModel.about(m,
                    m.trim(tas, StandardAtmosphere.geometricFromGeopotentialM(hp), 0.0));
            double[][] roots = Eigen4.eigenvalues(lm.a());
            double[] best = null;
            for (double[] z : roots) {
                if (z[1] > 0) {
                    double wn = Math.hypot(z[0], z[1]);
                    if (best == null || wn > best[0]) {
                        best = new double[] {wn, -z[0] / wn};
                    }
                }
            }
            return best;
        } catch (RuntimeException e) {
            return null;
        }
    }

    /** One line per point and metric: the analysed value, the truth's and the error, registry units. */
    public List<String> details() {
        return List.copyOf(details);
    }

    /** {@code name: value} lines: per kind and metric, count, median and 95th percentile of the absolute error,
     *  and the fraction within target where there is one. */
    public List<String> lines() {
        List<String> out = new ArrayList<>();
        out.add("analysis.sorties: " + sorties);
        out.add("analysis.points: " + points);
        for (Map.Entry<String, List<Double>> e : errors.entrySet()) {
            String key = e.getKey();
            boolean rel = relative.get(key);
            List<Double> src = rel ? relErrors.get(key) : e.getValue();
            double[] finite = src.stream().mapToDouble(Double::doubleValue).filter(Double::isFinite).toArray();
            int missing = src.size() - finite.length;
            String unit = rel ? " (relative)" : "";
            out.add("analysis." + key + ".count: " + src.size() + (missing > 0 ? " (" + missing + " not computed)" : ""));
            out.add(String.format(Locale.ROOT, "analysis.%s.median-abs-error%s: %.4g", key, unit,
                    Percentiles.median(finite)));
            out.add(String.format(Locale.ROOT, "analysis.%s.p95-abs-error%s: %.4g", key, unit,
                    Percentiles.of(finite, 0.95)));
            double target = targets.get(key);
            if (Double.isFinite(target)) {
                int within = 0;
                for (double v : finite) {
                    within += v <= target ? 1 : 0;
                }
                out.add(String.format(Locale.ROOT, "analysis.%s.within-%s%s: %.3f", key,
                        rel ? String.format(Locale.ROOT, "%.0f%%", target * 100) : String.format(Locale.ROOT, "%.0f",
                                target), "", src.isEmpty() ? Double.NaN : within / (double) src.size()));
            }
        }
        for (String p : problems.subList(0, Math.min(problems.size(), 20))) {
            out.add("analysis.not-computed: " + p);
        }
        return out;
    }

    /** Eigenvalues of a 4 x 4 real matrix: characteristic polynomial (Faddeev-LeVerrier), roots by Durand-Kerner. */
    static final class Eigen4 {
        private Eigen4() {
        }

        /** {re, im} of each eigenvalue. */
        static double[][] eigenvalues(double[][] a) {
            int n = 4;
            double[] c = new double[n + 1];
            c[n] = 1;
            double[][] m = new double[n][n];
            for (int k = 1; k <= n; k++) {
                // M_k = A M_{k-1} + c_{n-k+1} I ; c_{n-k} = -tr(A M_k) / k
                double[][] nm = new double[n][n];
                for (int i = 0; i < n; i++) {
                    for (int j = 0; j < n; j++) {
                        double s = 0;
                        for (int l = 0; l < n; l++) {
                            s += a[i][l] * m[l][j];
                        }
                        nm[i][j] = s + (i == j ? c[n - k + 1] : 0);
                    }
                }
                m = nm;
                double tr = 0;
                for (int i = 0; i < n; i++) {
                    for (int l = 0; l < n; l++) {
                        tr += a[i][l] * m[l][i];
                    }
                }
                c[n - k] = -tr / k;
            }
            // Durand-Kerner on the monic polynomial
            double[] re = new double[n];
            double[] im = new double[n];
            double scale = 0;
            for (int k = 0; k < n; k++) {
                scale = Math.max(scale, Math.pow(Math.abs(c[k]), 1.0 / (n - k)));
            }
            scale = Math.max(scale, 1e-3);
            for (int k = 0; k < n; k++) {
                double ang = 2 * Math.PI * k / n + 0.4;
                re[k] = scale * Math.cos(ang);
                im[k] = scale * Math.sin(ang);
            }
            for (int it = 0; it < 2000; it++) {
                double move = 0;
                for (int k = 0; k < n; k++) {
                    double pr = 1;
                    double pi = 0;
                    for (int d = n - 1; d >= 0; d--) {
                        double nr = pr * re[k] - pi * im[k] + c[d];
                        double ni = pr * im[k] + pi * re[k];
                        pr = nr;
                        pi = ni;
                    }
                    double qr = 1;
                    double qi = 0;
                    for (int j = 0; j < n; j++) {
                        if (j != k) {
                            double dr = re[k] - re[j];
                            double di = im[k] - im[j];
                            double nr = qr * dr - qi * di;
                            double ni = qr * di + qi * dr;
                            qr = nr;
                            qi = ni;
                        }
                    }
                    double den = qr * qr + qi * qi;
                    double sr = (pr * qr + pi * qi) / den;
                    double si = (pi * qr - pr * qi) / den;
                    re[k] -= sr;
                    im[k] -= si;
                    move = Math.max(move, Math.hypot(sr, si));
                }
                if (move < 1e-14 * scale) {
                    break;
                }
            }
            double[][] out = new double[n][];
            for (int k = 0; k < n; k++) {
                out[k] = new double[] {re[k], im[k]};
            }
            return out;
        }
    }
}
