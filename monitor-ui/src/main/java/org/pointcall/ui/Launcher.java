package org.pointcall.ui;

/** Entry point of the runnable jar. Not a JavaFX Application, so JavaFX loads from the classpath. */
public final class Launcher {
    private Launcher() {
    }

    public static void main(String[] args) {
        System.exit(0);
    }
}
