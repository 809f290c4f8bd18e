package org.pointcall.ui.console;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.InputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.Callable;
import java.util.concurrent.TimeUnit;

import javafx.scene.Node;
import javafx.scene.Scene;
import javafx.scene.control.Label;
import javafx.scene.input.KeyCode;
import javafx.stage.Stage;

import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.extension.ExtendWith;
import org.pointcall.ingest.frame.Frame;
import org.pointcall.ingest.sim.SortieSimulator;
import org.pointcall.ingest.sim.airframe.Airframes;
import org.pointcall.ingest.sim.pilot.PilotSettings;
import org.pointcall.ingest.sim.sensor.SensorSettings;
import org.pointcall.models.card.CardAnalysers;
import org.pointcall.models.card.CardPointState;
import org.pointcall.models.card.CardSession;
import org.pointcall.models.card.SessionSetup;
import org.pointcall.models.modelfile.LoadedModel;
import org.pointcall.models.modelfile.ModelFiles;
import org.pointcall.models.train.Classifier;
import org.pointcall.shared.card.TestCard;
import org.pointcall.shared.demo.DemoFiles;
import org.pointcall.shared.dictionary.ParameterDictionary;
import org.pointcall.shared.outcome.SessionEvent;
import org.pointcall.ui.demo.DeskPublisher;
import org.pointcall.ui.demo.HealthReader;
import org.pointcall.ui.demo.SessionDesk;
import org.pointcall.ui.desk.DeskLink;
import org.pointcall.ui.settings.ConsoleSettings;
import org.testfx.api.FxRobot;
import org.testfx.framework.junit5.ApplicationExtension;
import org.testfx.framework.junit5.Start;
import org.testfx.util.WaitForAsyncUtils;

import io.micrometer.core.instrument.simple.SimpleMeterRegistry;

/**
 * The console on a real card session (demo card, default model, simulated frames fed on this thread as the
 * pipeline would): keys and clicks go through the link to the session, and the screen shows what the session then
 * publishes. Nodes are looked up by id.
 */
@ExtendWith(ApplicationExtension.class)
class ConsoleViewTest {
    private static LoadedModel<Classifier> model;

    private final ParameterDictionary dict = DemoFiles.dictionary();
    private final TestCard card = DemoFiles.card();
    private SessionDesk desk;
    private CardSession session;
    private DeskLink link;
    private DeskPublisher publisher;
    private ConsoleView view;

    static synchronized LoadedModel<Classifier> model() throws IOException {
        if (model == null) {
            Path tmp = Files.createTempFile("pointcall-test-model-", ".pcm");
            try (InputStream in = ConsoleViewTest.class.getResourceAsStream("/org/pointcall/ui/models/default.pcm")) {
                Files.copy(in, tmp, java.nio.file.StandardCopyOption.REPLACE_EXISTING);
                model = ModelFiles.load(tmp, Classifier.class);
            } finally {
                Files.deleteIfExists(tmp);
            }
        }
        return model;
    }

    @Start
    void start(Stage stage) throws IOException {
        desk = new SessionDesk(card, dict);
        session = new CardSession(SessionSetup.of(dict, card, model().model(), model().metadata().description(),
                CardAnalysers.standard()), desk);
        desk.bind(session);
        link = new DeskLink();
        publisher = new DeskPublisher(link, desk, new HealthReader(new SimpleMeterRegistry()),
                () -> session.snapshot().timeNs() / 10_000_000L);
        view = new ConsoleView(new ConsoleSetup("test", link, null, ConsoleSettings.defaults(), null, false, 30,
                TraceDrawing.ENVELOPE));
        stage.setScene(new Scene(view.root(), 1400, 900));
        stage.show();
        view.root().requestFocus();
        view.start();
        publisher.publishOnce(System.nanoTime());
    }

    @AfterEach
    void stopPump() throws Exception {
        WaitForAsyncUtils.asyncFx(() -> view.stop()).get(5, TimeUnit.SECONDS);
    }

    /** Hands queued commands to the session, lets it apply them at a frame, and publishes. */
    private void step(long timeNs) {
        publisher.publishOnce(System.nanoTime());
        Frame f = Frame.forDictionary(dict);
        f.timeNs(timeNs);
        session.onFrame(f);
        publisher.publishOnce(System.nanoTime());
    }

    private static void waitUntil(Callable<Boolean> c) throws Exception {
        WaitForAsyncUtils.waitFor(10, TimeUnit.SECONDS, c);
    }

    private static String text(FxRobot robot, String id) {
        Node n = robot.lookup("#" + id).query();
        return ((Label) n).getText();
    }

    /** Flies the demo card on the simulator into the session until its first point has its verdict. */
    private void flyFirstPoint() {
        SortieSimulator sim = new SortieSimulator(Airframes.load("veskarn-02"), card, dict, 1, 32,
                SensorSettings.DEFAULT, PilotSettings.DEFAULT);
        final class Done extends RuntimeException {
            private static final long serialVersionUID = 1L;
        }
        boolean[] finished = {false};
        try {
            sim.run(List.of(f -> {
                if (finished[0]) {
                    throw new Done();
                }
                session.onFrame(f);
                for (var p : session.snapshot().points()) {
                    if (p.id().equals("SL-1") && p.toolVerdict() != null) {
                        finished[0] = true;
                    }
                }
            }));
        } catch (Done expected) {
            // the first point has its verdict: enough sortie
        }
        publisher.publishOnce(System.nanoTime());
    }

    /** With -Dpointcall.test.screenshots=DIR, keeps a PNG of the screen for a person to look at. */
    private void shoot(String name) throws Exception {
        String d = System.getProperty("pointcall.test.screenshots");
        if (d != null && !d.isBlank()) {
            WaitForAsyncUtils.asyncFx(() -> ConsoleView.savePng(view.root().getScene(), Path.of(d, name)))
                    .get(10, TimeUnit.SECONDS);
        }
    }

    @Test
    void arrowKeysThenAArmTheSelectedPointAndTheCardShowsItPrimed(FxRobot robot) throws Exception {
        waitUntil(() -> text(robot, "card-state-ST-1").startsWith("WAITING"));
        robot.type(KeyCode.DOWN, KeyCode.DOWN, KeyCode.A);
        waitUntil(() -> link.sentCount() == 1);
        step(0);
        assertEquals(CardPointState.ARMED, session.snapshot().points().get(2).state(), "the session armed ST-1");
        waitUntil(() -> text(robot, "card-state-ST-1").equals("PRIMED"));
        assertTrue(text(robot, "card-state-SL-1").startsWith("WAITING"), "only the selected point is armed");
    }

    @Test
    void aVerdictShowsLargeUntilKAcknowledgesItThenRAndANoteCallARepeat(FxRobot robot) throws Exception {
        flyFirstPoint();
        String tool = session.snapshot().points().get(0).toolVerdict().name();
        waitUntil(() -> robot.lookup("#verdict-overlay").query().isVisible()
                && tool.equals(text(robot, "verdict-word")));
        assertEquals(tool, text(robot, "verdict-word"), "the overlay shows the session's verdict");
        assertEquals("point SL-1", text(robot, "verdict-point"));

        robot.type(KeyCode.K);
        waitUntil(() -> link.sentCount() == 1);
        publisher.publishOnce(System.nanoTime());
        waitUntil(() -> !robot.lookup("#verdict-overlay").query().isVisible());

        robot.type(KeyCode.R);
        waitUntil(() -> robot.lookup("#call-note").query().isFocused());
        robot.write("entry too fast");
        robot.type(KeyCode.ENTER);
        waitUntil(() -> link.sentCount() == 2);
        step(session.snapshot().timeNs() + 31_250_000L);
        assertEquals(CardPointState.REPEAT, session.snapshot().points().get(0).state(), "the session took the call");
        waitUntil(() -> text(robot, "card-state-SL-1").startsWith("REPEAT"));
        waitUntil(() -> text(robot, "card-row-SL-1-title").contains("entry too fast"));
    }

    @Test
    void aBrokenLimitRaisesTheAlarmStripAndKAcknowledgesIt(FxRobot robot) throws Exception {
        int nz = dict.indexOf("Nz");
        Frame f = Frame.forDictionary(dict);
        for (int i = 0; i < 20; i++) {
            f.clear();
            f.timeNs(i * 31_250_000L);
            f.value(nz, i < 10 ? 1.0 : 6.8); // the demo card limits Nz to at most 6 g
            session.onFrame(f);
        }
        publisher.publishOnce(System.nanoTime());
        assertTrue(desk.events().stream().anyMatch(e -> e.kind() == org.pointcall.ui.desk.LogEntry.Kind.ALARM),
                "the session raised the alarm");
        waitUntil(() -> robot.lookup("#alarm-strip").query().isVisible()
                && "1 to acknowledge".equals(text(robot, "alarm-count")));
        assertTrue(text(robot, "alarm-text").contains("Nz"), text(robot, "alarm-text"));
        assertEquals("1 to acknowledge", text(robot, "alarm-count"));
        assertFalse(robot.lookup("#alarm-strip").query().getStyleClass().contains("seen"));
        shoot("console-alarm.png");

        robot.type(KeyCode.K);
        waitUntil(() -> link.sentCount() == 1);
        publisher.publishOnce(System.nanoTime());
        // the strip's style and its count text change on the same snapshot but may land on different pulses
        waitUntil(() -> robot.lookup("#alarm-strip").query().getStyleClass().contains("seen")
                && "acknowledged".equals(text(robot, "alarm-count")));
        assertEquals("acknowledged", text(robot, "alarm-count"), "still broken, now acknowledged");
        waitUntil(() -> ((javafx.scene.control.ListView<?>) robot.lookup("#event-log").query()).getItems().stream()
                .anyMatch(o -> o.toString().contains("acknowledged")));
    }

    @Test
    void sessionEventsHaveTheirOwnTypes() {
        // guards the adapter's mapping: a new event type of the session must be placed in the log deliberately
        // (a withdrawn begin is a POINT line, and its span leaves the time line: SessionDesk)
        assertEquals(8, SessionEvent.class.getPermittedSubclasses().length);
    }
}
