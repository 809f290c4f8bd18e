package org.pointcall.ui.console;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.ByteBuffer;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.Callable;
import java.util.concurrent.TimeUnit;

import javafx.scene.Scene;
import javafx.scene.control.Label;
import javafx.scene.input.KeyCode;
import javafx.stage.Stage;

import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.extension.ExtendWith;
import org.junit.jupiter.api.io.TempDir;
import org.pointcall.ingest.sim.SortieSimulator;
import org.pointcall.ingest.sim.airframe.Airframes;
import org.pointcall.ingest.sim.pilot.PilotSettings;
import org.pointcall.ingest.sim.sensor.SensorSettings;
import org.pointcall.ingest.wire.StreamEncoder;
import org.pointcall.ingest.wire.WireOptions;
import org.pointcall.models.card.CardAnalysers;
import org.pointcall.models.card.CardSession;
import org.pointcall.models.card.SessionSetup;
import org.pointcall.replay.archive.ArchiveReader;
import org.pointcall.replay.play.ArchiveSource;
import org.pointcall.replay.play.ReplayClock;
import org.pointcall.replay.play.ReplayControl;
import org.pointcall.replay.play.ReplayState;
import org.pointcall.replay.play.ReplayTargets;
import org.pointcall.replay.play.Replayer;
import org.pointcall.replay.record.Recorder;
import org.pointcall.replay.record.RecorderPolicy;
import org.pointcall.shared.card.TestCard;
import org.pointcall.shared.demo.DemoFiles;
import org.pointcall.shared.dictionary.DictionaryFiles;
import org.pointcall.shared.dictionary.ParameterDictionary;
import org.pointcall.ui.demo.LiveConsole;
import org.pointcall.ui.demo.ReplayDeck;
import org.pointcall.ui.demo.SessionDesk;
import org.pointcall.ui.settings.ConsoleSettings;
import org.testfx.api.FxRobot;
import org.testfx.framework.junit5.ApplicationExtension;
import org.testfx.framework.junit5.Start;
import org.testfx.util.WaitForAsyncUtils;

/**
 * A recorded sortie (simulator frames recorded by the real recorder into a real archive) replayed through the
 * pipeline and the card session into the console; the transport keys pause and seek it.
 */
@ExtendWith(ApplicationExtension.class)
class ReplayConsoleTest {
    private static final double RECORDED_S = 60;

    @TempDir
    static Path dir;

    private final ParameterDictionary dict = DemoFiles.dictionary();
    private final TestCard card = DemoFiles.card();
    private ReplayDeck deck;
    private Path settingsFile;
    private ArchiveReader reader;
    private ConsoleView view;

    /** 60 s of the demo sortie at 32 Hz, recorded with the data time as arrival time. */
    private Path record() {
        Path file = dir.resolve("sortie.pcsa");
        if (java.nio.file.Files.exists(file)) {
            return file; // recorded once for the class; archives are never overwritten
        }
        Recorder rec = Recorder.start(file, RecorderPolicy.DEFAULT, System::nanoTime, a -> { });
        long[] now = {0};
        StreamEncoder enc = new StreamEncoder(1, StreamEncoder.newEpoch(), dict, DictionaryFiles.toYaml(dict),
                WireOptions.DEFAULT.withSynthetic(true), (ByteBuffer p) -> {
                    while (!rec.offer(p, now[0])) {
                        Thread.onSpinWait();
                    }
                });
        final class Enough extends RuntimeException {
            private static final long serialVersionUID = 1L;
        }
        SortieSimulator sim = new SortieSimulator(Airframes.load("veskarn-02"), card, dict, 1, 32,
                SensorSettings.DEFAULT, PilotSettings.DEFAULT);
        try {
            sim.run(List.of(f -> {
                if (f.timeNs() > RECORDED_S * 1e9) {
                    throw new Enough();
                }
                now[0] = f.timeNs();
                enc.onFrame(f);
            }));
        } catch (Enough expected) {
            // a minute of sortie is enough to pause and seek in
        }
        enc.flush();
        rec.close();
        return file;
    }

    @Start
    void start(Stage stage) throws Exception {
        reader = ArchiveReader.open(record());
        var model = ConsoleViewTest.model();
        deck = new ReplayDeck(reader, card, dict, ConsoleSettings.defaults(),
                (d, l) -> new CardSession(SessionSetup.of(d, card, model.model(), model.metadata().description(),
                        CardAnalysers.standard()), l), line -> { });
        deck.start(1, false);
        settingsFile = dir.resolve("console-" + System.nanoTime() + ".conf");
        view = new ConsoleView(new ConsoleSetup("replay test", deck.link(), deck.traces(), ConsoleSettings.defaults(),
                settingsFile, true, 30, TraceDrawing.ENVELOPE));
        stage.setScene(new Scene(view.root(), 1400, 900));
        stage.show();
        view.root().requestFocus();
        view.start();
    }

    @AfterEach
    void stop() throws Exception {
        deck.close();
        reader.close();
        WaitForAsyncUtils.asyncFx(() -> view.stop()).get(5, TimeUnit.SECONDS);
    }

    private static void waitUntil(Callable<Boolean> c) throws Exception {
        WaitForAsyncUtils.waitFor(20, TimeUnit.SECONDS, c);
    }

    private static String text(FxRobot robot, String id) {
        return ((Label) robot.lookup("#" + id).query()).getText();
    }

    /** Seconds shown as the replay position ("mm:ss / mm:ss ..."). */
    private static int shownSeconds(FxRobot robot) {
        String t = text(robot, "transport-position");
        return Integer.parseInt(t.substring(0, 2)) * 60 + Integer.parseInt(t.substring(3, 5));
    }

    @Test
    void spacePausesTheReplayAndRightArrowSeeksItForward(FxRobot robot) throws Exception {
        waitUntil(() -> text(robot, "transport-position").contains("playing") && shownSeconds(robot) >= 2);

        robot.type(KeyCode.SPACE);
        waitUntil(() -> deck.control().state() == ReplayState.PAUSED);
        waitUntil(() -> text(robot, "transport-position").contains("PAUSED"));
        int pausedAt = shownSeconds(robot);
        String lane = text(robot, "lane-value-Hp");
        Thread.sleep(1500);
        assertEquals(pausedAt, shownSeconds(robot), "a paused replay stands still");
        assertEquals(lane, text(robot, "lane-value-Hp"), "and so do the traces");

        robot.type(KeyCode.RIGHT); // 10 s forward
        robot.type(KeyCode.SPACE);
        waitUntil(() -> deck.control().state() == ReplayState.PLAYING);
        // at 1x, playing alone would need 10 s to get there: within 6 s only the seek does it
        WaitForAsyncUtils.waitFor(6, TimeUnit.SECONDS, () -> shownSeconds(robot) >= pausedAt + 10);
        assertTrue(text(robot, "transport-position").contains("playing"), text(robot, "transport-position"));
        assertTrue(Double.parseDouble(text(robot, "lane-value-Hp")) > 5000, "the traces go on after the seek");
    }

    /** Seconds of data time the header shows ("T+hh:mm:ss"). */
    private static int headerSeconds(FxRobot robot) {
        String t = text(robot, "header-time");
        int i = t.indexOf("T+");
        String[] f = t.substring(i + 2, i + 10).split(":");
        return Integer.parseInt(f[0]) * 3600 + Integer.parseInt(f[1]) * 60 + Integer.parseInt(f[2]);
    }

    /**
     * Back 10 s: the screen (transport, data clock, traces and card) shows that moment again, as it was then,
     * and the replay plays on from there.
     */
    @Test
    void leftArrowGoesBackAndTheScreenShowsThatMomentAgain(FxRobot robot) throws Exception {
        waitUntil(() -> text(robot, "transport-position").contains("playing") && shownSeconds(robot) >= 2);
        robot.type(KeyCode.RIGHT);
        robot.type(KeyCode.RIGHT); // 20 s on
        waitUntil(() -> shownSeconds(robot) >= 22 && text(robot, "transport-position").contains("playing"));
        int before = shownSeconds(robot);
        var firstPass = deck.live();
        robot.type(KeyCode.LEFT); // 10 s back
        WaitForAsyncUtils.waitFor(6, TimeUnit.SECONDS, () -> deck.live() != firstPass
                && text(robot, "transport-position").contains("playing") && shownSeconds(robot) <= before - 6);
        int after = shownSeconds(robot);
        WaitForAsyncUtils.waitFor(3, TimeUnit.SECONDS, () -> Math.abs(headerSeconds(robot) - after) <= 2);
        Thread.sleep(2000);
        int later = shownSeconds(robot);
        assertTrue(later >= after + 1 && later <= after + 4, "it plays on from there at 1x: " + after + " -> " + later);
        assertTrue(Math.abs(headerSeconds(robot) - later) <= 2,
                "the data clock went back with it: " + text(robot, "header-time") + " at " + later);
        double hp = Double.parseDouble(text(robot, "lane-value-Hp"));
        assertTrue(hp > 5000, "the traces go on after the jump back: Hp " + hp);
    }

    /**
     * L opens the chart-group editor; a group naming a parameter the stream lacks is refused with its name and
     * nothing changes; good groups change the lanes at once, each lane shows its own parameter's values (Nz near
     * 1 g, not another channel's), a lane kept keeps its value, and the layout file is written.
     */
    @Test
    void chartGroupsAreEditedOnScreenAndKept(FxRobot robot) throws Exception {
        waitUntil(() -> text(robot, "transport-position").contains("playing") && shownSeconds(robot) >= 2);
        robot.type(KeyCode.L);
        waitUntil(() -> robot.lookup("#lanes-panel").query().isVisible());
        javafx.scene.control.TextArea area = robot.lookup("#lanes-text").query();
        assertEquals("energy: Hp, KCAS, Mach\npitch: AoA, Pitch, Nz, Elevator\n", area.getText(),
                "the editor opens on the groups shown, and the L that opened it is not typed into it");
        robot.interact(() -> area.setText("attitude: Pitch, Nz\nspeed: KCAS, Bogus\n"));
        robot.clickOn("#lanes-apply");
        waitUntil(() -> text(robot, "lanes-message").contains("Bogus"));
        assertTrue(robot.lookup("#lanes-panel").query().isVisible(), "a refused edit leaves the editor open");
        assertTrue(robot.lookup("#lane-chart-Hp").tryQuery().isPresent(), "and the lanes as they were");

        robot.interact(() -> area.setText("attitude: Pitch, Nz\nspeed: KCAS\n"));
        robot.press(KeyCode.CONTROL).type(KeyCode.ENTER).release(KeyCode.CONTROL);
        waitUntil(() -> !robot.lookup("#lanes-panel").query().isVisible());
        assertTrue(robot.lookup("#lane-chart-Hp").tryQuery().isEmpty(), "Hp is no longer charted");
        waitUntil(() -> text(robot, "lane-value-Nz").matches("-?[0-9.]+"));
        double nz = Double.parseDouble(text(robot, "lane-value-Nz"));
        assertTrue(Math.abs(nz - 1) < 3, "the Nz lane shows Nz: " + nz);
        double kcas = Double.parseDouble(text(robot, "lane-value-KCAS"));
        assertTrue(kcas > 100 && kcas < 500, "the KCAS lane shows KCAS: " + kcas);
        String file = java.nio.file.Files.readString(settingsFile);
        assertTrue(file.contains("group.1 = attitude: Pitch, Nz") && file.contains("group.2 = speed: KCAS")
                && !file.contains("group.3"), file);
    }
}
