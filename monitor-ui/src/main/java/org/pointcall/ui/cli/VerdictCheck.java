package org.pointcall.ui.cli;

import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;

import org.pointcall.ingest.sim.truth.SortieTruth;
import org.pointcall.models.card.CardAnalysers;
import org.pointcall.models.card.CardSession;
import org.pointcall.models.card.LiveBegins;
import org.pointcall.models.card.RecordingPlayer;
import org.pointcall.models.card.SessionSetup;
import org.pointcall.models.card.VerdictAgreement;
import org.pointcall.models.data.DatasetBuilder;
import org.pointcall.models.detect.DetectorSettings;
import org.pointcall.models.modelfile.LoadedModel;
import org.pointcall.models.run.SortieSets;
import org.pointcall.models.train.Classifier;
import org.pointcall.shared.card.TestCard;
import org.pointcall.shared.dictionary.ParameterDictionary;
import org.pointcall.shared.error.PointcallException;
import org.pointcall.shared.outcome.SessionEvent;

/** {@code evaluate --verdicts}: the tool's verdicts on simulated sorties against their truth. */
final class VerdictCheck {
    private VerdictCheck() {
    }

    static void run(PrintWriter w, Path modelFile, Path cardFile, Path dictionaryFile, List<Path> data,
                    List<String> without, boolean details) {
        if (data.isEmpty()) {
            throw new PointcallException("--verdicts needs --data DIR... (simulated sorties with truth.json)");
        }
        DetectorSettings settings = DetectorSettings.defaults().withRulesOff(without);
        LoadedModel<Classifier> model = DetectorModel.load(modelFile);
        VerdictAgreement agreement = new VerdictAgreement();
        LiveBegins live = new LiveBegins();
        for (Path dir : SortieSets.find(data)) {
            Path recording = dir.resolve(DatasetBuilder.SIM_RECORDING);
            Path truthFile = dir.resolve(DatasetBuilder.SIM_TRUTH);
            if (!Files.isRegularFile(truthFile)) {
                throw new PointcallException(dir + ": no " + DatasetBuilder.SIM_TRUTH + " in it");
            }
            ParameterDictionary dict = AnalyzeCommand.dictionary(dictionaryFile, recording);
            Path c = cardFile != null ? cardFile : dir.resolve("card.yaml");
            TestCard card = AnalyzeCommand.loadCard(c, dict);
            List<SessionEvent> events = new ArrayList<>();
            CardSession session = new CardSession(new SessionSetup(dict, card, model.model(),
                    model.metadata().description(), settings, CardAnalysers.standard(),
                    SessionSetup.DEFAULT_SNAPSHOT_INTERVAL_S), events::add);
            RecordingPlayer.play(recording, session);
            SortieTruth truth = SortieTruth.read(truthFile);
            agreement.add(dir.getFileName().toString(), truth, session.outcomes());
            live.add(truth, events);
        }
        for (String l : agreement.lines()) {
            w.println(l);
        }
        for (String l : details ? live.details() : List.<String>of()) {
            w.println(l);
        }
        for (String l : live.lines()) {
            w.println(l);
        }
        w.flush();
    }
}
