/**
 * Sliding-window features: every sample of the selected parameters passes through here on its way to the
 * classifier.
 *
 * <p>{@link org.pointcall.ingest.window.FeatureExtractor#bind FeatureExtractor.bind} takes a dictionary, one
 * {@link org.pointcall.ingest.window.WindowSpec} per parameter (its window lengths) and
 * {@link org.pointcall.ingest.window.ExtractorSettings}; names are resolved to frame slots there, once. The extractor
 * is a {@code FrameSink}; at every multiple of the decision period on data time it hands one reusable vector to its
 * {@link org.pointcall.ingest.window.FeatureListener}: for each window the six
 * {@link org.pointcall.ingest.window.Stat statistics} (mean, sample standard deviation, min, max, least-squares
 * slope per second, last minus first) over the samples in {@code [t - L, t]}, named
 * {@code <parameter>.<stat>.<length>s} by the {@link org.pointcall.ingest.window.FeatureLayout}, with a validity
 * flag and a coverage fraction per window beside it. NaN values are "not sampled in this frame" and skipped, so
 * mixed rates need nothing special. A window is valid only when its data covers all of {@code [t - L, t]} with no
 * gap (an interval beyond the gap threshold, a frame flagged {@code GAP_BEFORE}, or a stale newest sample) and
 * holds the minimum number of samples; an invalid window's statistics are NaN unless
 * {@link org.pointcall.ingest.window.InvalidWindowPolicy#KEEP} is chosen.
 *
 * <p>Cost: O(1) amortised per sample and window, nothing allocated per sample or tick once the primitive rings
 * (sized at bind from the dictionary rates) are warm. Running sums are anchored on a sample of the window,
 * recomputed exactly once per window turnover and compensated, so offsets like 1e6 and long runs cost no digits;
 * min and max come from monotonic index deques shared by a parameter's windows.
 *
 * <p>Threads: single-threaded, on the stream's pipeline thread.
 *
 * <p>Benchmarks, for the reference workload {@link org.pointcall.ingest.window.W1Workload W1} (256 parameters at
 * 1,000 frames/s, features on 24 of them over 0.5, 2 and 8 s at 20 Hz), both reporting against a CRC-32C pass over
 * the same bytes measured in the same run. From the repository root:
 * <pre>
 * # JMH (jmh-core is a test dependency of ingest; Surefire never runs it)
 * mvn -B -ntp -q -pl ingest -am test-compile \
 *     org.apache.maven.plugins:maven-dependency-plugin:3.8.1:build-classpath \
 *     -Dmdep.includeScope=test -Dmdep.outputFile=target/bench.cp
 * java -cp "ingest/target/test-classes:ingest/target/classes:$(cat ingest/target/bench.cp)" \
 *     org.openjdk.jmh.Main FeatureExtractorBenchmark -prof gc
 *
 * # plain harness (what a bench command calls): name: value unit lines
 * printf 'org.pointcall.ingest.window.FeatureBench.run(60).lines().forEach(System.out::println)\n/exit\n' \
 *     | jshell -q --class-path ingest/target/classes:shared/target/classes
 * </pre>
 */
package org.pointcall.ingest.window;
