package org.pointcall.ui.cli;

import java.io.PrintWriter;

import org.pointcall.shared.error.PointcallException;

import picocli.CommandLine;
import picocli.CommandLine.Command;

/** The root command: lists the subcommands and turns every user error into one line and exit code 2. */
@Command(name = "pointcall",
        mixinStandardHelpOptions = true,
        versionProvider = PointcallCommand.Version.class,
        description = {
            "Ground-station aid for flight test engineers: finds test points in live",
            "or recorded telemetry, checks them against their tolerance bands and",
            "proposes a call.",
            "",
            "It aids the test team: it does not replace the test conductor, the test",
            "plan's limits or the flight manual."
        },
        subcommands = {
            AirDataCommand.class,
            CheckCommand.class,
            ExamplesCommand.class,
            InspectCommand.class,
            RecordCommand.class,
            ReplayCommand.class,
            SimulateCommand.class,
            SortieSetCommand.class,
            TrainCommand.class,
            EvaluateCommand.class,
            AnalyzeCommand.class,
            MonitorCommand.class,
            NextCardCommand.class,
            ReportCommand.class,
            BenchCommand.class,
            DemoCommand.class,
            ConsoleCommand.class,
            CommandLine.HelpCommand.class
        })
public final class PointcallCommand implements Runnable {
    /** Exit code for bad input: arguments, files, packets. */
    public static final int EXIT_BAD_INPUT = 2;
    /** Exit code for an internal fault (a bug): reported in one line too, with a hint. */
    public static final int EXIT_INTERNAL = 3;

    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    @Override
    public void run() {
        spec.commandLine().usage(spec.commandLine().getOut());
    }

    /** Runs a command line with the project's error policy; returns the exit code. */
    public static int run(String... args) {
        return newCommandLine().execute(args);
    }

    /** Width of the help text, characters. */
    static final int USAGE_WIDTH = 110;

    public static CommandLine newCommandLine() {
        CommandLine cl = new CommandLine(new PointcallCommand());
        cl.setExecutionExceptionHandler(PointcallCommand::onExecutionException);
        cl.setParameterExceptionHandler(PointcallCommand::onParameterException);
        // the descriptions are written as lines of up to about 100 characters; at picocli's 80 every one of them
        // would be broken again mid-line
        cl.setUsageHelpWidth(USAGE_WIDTH);
        return cl;
    }

    private static int onParameterException(CommandLine.ParameterException ex, String[] args) {
        PrintWriter err = ex.getCommandLine().getErr();
        String name = ex.getCommandLine().getCommandSpec().qualifiedName();
        err.println(name + ": " + ex.getMessage());
        err.println("Try '" + name + " --help'.");
        err.flush();
        return EXIT_BAD_INPUT;
    }

    private static int onExecutionException(Exception ex, CommandLine cl, CommandLine.ParseResult parsed) {
        PrintWriter err = cl.getErr();
        String where = cl.getCommandSpec().qualifiedName() + ": ";
        if (ex instanceof PointcallException || ex instanceof IllegalArgumentException) {
            err.println(where + ex.getMessage());
            err.flush();
            return EXIT_BAD_INPUT;
        }
        err.println(where + "internal error (" + ex.getClass().getSimpleName() + ": " + ex.getMessage()
                + "); please report it with the command you ran");
        err.flush();
        return EXIT_INTERNAL;
    }

    /** Version from the jar manifest, or "development" when run from classes. */
    static final class Version implements CommandLine.IVersionProvider {
        @Override
        public String[] getVersion() {
            String v = PointcallCommand.class.getPackage().getImplementationVersion();
            return new String[] {"pointcall " + (v == null ? "development build" : v)};
        }
    }
}
