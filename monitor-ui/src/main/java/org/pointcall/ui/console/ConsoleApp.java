package org.pointcall.ui.console;

import java.nio.file.Path;
import java.util.concurrent.atomic.AtomicReference;

import javafx.animation.PauseTransition;
import javafx.application.Application;
import javafx.application.Platform;
import javafx.scene.Scene;
import javafx.stage.Stage;
import javafx.util.Duration;

import org.pointcall.ui.settings.SettingsFile;

/**
 * The console as a JavaFX application. The launcher is not an {@code Application}; it calls {@link #run}, which
 * blocks until the window closes.
 */
public final class ConsoleApp extends Application {
    /** A screenshot taken {@code afterS} seconds after the window shows, then the console closes. */
    public record Screenshot(Path file, double afterS) {
        public Screenshot {
            if (!(afterS >= 0)) {
                throw new IllegalArgumentException("--after must be >= 0 s");
            }
        }
    }

    private static final AtomicReference<ConsoleSetup> SETUP = new AtomicReference<>();
    private static final AtomicReference<Screenshot> SHOT = new AtomicReference<>();
    private static final AtomicReference<Throwable> FAILURE = new AtomicReference<>();

    private ConsoleView view;

    /** Opens the console and waits for it to close; a screenshot plan may be {@code null}. */
    public static void run(ConsoleSetup setup, Screenshot screenshot) {
        SETUP.set(setup);
        SHOT.set(screenshot);
        FAILURE.set(null);
        Application.launch(ConsoleApp.class);
        Throwable t = FAILURE.get();
        if (t instanceof RuntimeException r) {
            throw r;
        }
        if (t != null) {
            throw new IllegalStateException(t);
        }
    }

    /** True when a window can be opened here (a display, and on Linux the GTK 3 library JavaFX needs). */
    public static boolean displayAvailable() {
        return windowProblem() == null;
    }

    /**
     * Why no window can be opened here, in words for a user, or null when one can: no display, or (Linux, BSD)
     * no GTK 3, which JavaFX's windowing needs and a server or container install often lacks.
     */
    public static String windowProblem() {
        if (!hasDisplay()) {
            return "no display (DISPLAY is not set)";
        }
        String os = System.getProperty("os.name", "").toLowerCase(java.util.Locale.ROOT);
        if ((os.contains("linux") || os.contains("bsd")) && !hasGtk3()) {
            return "a display is set but the GTK 3 library is missing (JavaFX needs it; on Debian or Ubuntu: "
                    + "apt-get install libgtk-3-0)";
        }
        return null;
    }

    private static boolean hasGtk3() {
        String[] dirs = {"/usr/lib/x86_64-linux-gnu", "/usr/lib/aarch64-linux-gnu", "/usr/lib64", "/usr/lib",
            "/lib/x86_64-linux-gnu", "/lib64", "/usr/local/lib"};
        for (String d : dirs) {
            if (java.nio.file.Files.exists(java.nio.file.Path.of(d, "libgtk-3.so.0"))) {
                return true;
            }
        }
        String ld = System.getenv("LD_LIBRARY_PATH");
        if (ld != null) {
            for (String d : ld.split(":")) {
                if (!d.isBlank() && java.nio.file.Files.exists(java.nio.file.Path.of(d, "libgtk-3.so.0"))) {
                    return true;
                }
            }
        }
        return false;
    }

    private static boolean hasDisplay() {
        String os = System.getProperty("os.name", "").toLowerCase(java.util.Locale.ROOT);
        if (os.contains("linux") || os.contains("bsd")) {
            String d = System.getenv("DISPLAY");
            String w = System.getenv("WAYLAND_DISPLAY");
            return (d != null && !d.isBlank()) || (w != null && !w.isBlank());
        }
        return !java.awt.GraphicsEnvironment.isHeadless();
    }

    @Override
    public void start(Stage stage) {
        ConsoleSetup setup = SETUP.get();
        view = new ConsoleView(setup);
        Scene scene = new Scene(view.root(), setup.settings().widthPx(), setup.settings().heightPx());
        stage.setTitle(setup.title());
        stage.setScene(scene);
        stage.show();
        view.root().requestFocus();
        view.start();
        Screenshot shot = SHOT.get();
        if (shot != null) {
            PauseTransition wait = new PauseTransition(Duration.seconds(Math.max(0.5, shot.afterS())));
            wait.setOnFinished(e -> {
                try {
                    ConsoleView.savePng(scene, shot.file());
                } catch (RuntimeException ex) {
                    FAILURE.set(ex);
                }
                Platform.exit();
            });
            wait.play();
        }
    }

    @Override
    public void stop() {
        if (view == null) {
            return;
        }
        view.stop();
        ConsoleSetup setup = SETUP.get();
        if (setup.settingsFile() != null && SHOT.get() == null) {
            try {
                SettingsFile.save(setup.settingsFile(), view.currentSettings());
            } catch (RuntimeException e) {
                FAILURE.set(e);
            }
        }
    }
}
