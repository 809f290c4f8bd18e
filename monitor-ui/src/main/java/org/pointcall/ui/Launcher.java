package org.pointcall.ui;

import org.pointcall.ui.cli.PointcallCommand;

/**
 * Entry point of the runnable jar. It is deliberately not a {@code javafx.application.Application}: started from
 * the classpath, JavaFX then loads as an ordinary library.
 */
public final class Launcher {
    private Launcher() {
    }

    public static void main(String[] args) {
        System.exit(PointcallCommand.run(args));
    }
}
