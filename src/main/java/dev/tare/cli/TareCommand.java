package dev.tare.cli;

import dev.tare.Tare;
import dev.tare.TareException;
import java.io.PrintWriter;
import picocli.CommandLine;
import picocli.CommandLine.Command;

/** The top-level {@code tare} command, which only holds the subcommands. */
@Command(name = "tare",
        mixinStandardHelpOptions = true,
        versionProvider = TareCommand.Version.class,
        description = "Measures and shrinks the token footprint of the prompt templates in a repository.",
        subcommands = {ScanCommand.class, CheckCommand.class, FixCommand.class, CountCommand.class, CostCommand.class, TargetsCommand.class,
                RulesCommand.class, ExplainCommand.class, BaselineCommand.class, CalibrateCommand.class,
                HookCommand.class, InitCommand.class,
                CommandLine.HelpCommand.class},
        footer = {"", "Exit codes: 0 ok, 1 findings, a budget breach or a file left unfixed by fix, 2 usage, configuration or input error,"
                + " 3 internal error (add --debug for the stack trace)."})
public final class TareCommand implements Runnable {
    @CommandLine.Spec
    private CommandLine.Model.CommandSpec spec;

    @Override
    public void run() {
        throw new CommandLine.ParameterException(spec.commandLine(), "name a command, for example: tare scan .");
    }

    /** A configured command line writing to {@code out} and {@code err}; also what tests drive. */
    public static CommandLine commandLine(PrintWriter out, PrintWriter err) {
        CommandLine commandLine = new CommandLine(new TareCommand());
        commandLine.setOut(out);
        commandLine.setErr(err);
        commandLine.setCaseInsensitiveEnumValuesAllowed(true);
        commandLine.setExecutionExceptionHandler(TareCommand::handleExecutionException);
        commandLine.setExecutionStrategy(parseResult -> {
            long started = System.nanoTime();
            int code = new CommandLine.RunLast().execute(parseResult);
            if (requested(parseResult, "--timings")) {
                Timings.print(commandLine.getErr(), started);
            }
            return code;
        });
        commandLine.setParameterExceptionHandler(TareCommand::handleParameterException);
        return commandLine;
    }

    private static int handleExecutionException(Exception ex, CommandLine commandLine, CommandLine.ParseResult parseResult) {
        PrintWriter err = commandLine.getErr();
        boolean debug = requested(parseResult, "--debug");
        if (ex instanceof TareException) {
            err.println("tare: " + ex.getMessage());
            if (debug) {
                ex.printStackTrace(err);
            }
            err.flush();
            return ExitCodes.USAGE;
        }
        err.println("tare: internal error: " + ex + (debug ? "" : " (run again with --debug for the stack trace)"));
        if (debug) {
            ex.printStackTrace(err);
        }
        err.flush();
        return ExitCodes.INTERNAL;
    }

    private static int handleParameterException(CommandLine.ParameterException ex, String[] args) {
        CommandLine commandLine = ex.getCommandLine();
        PrintWriter err = commandLine.getErr();
        err.println("tare: " + ex.getMessage());
        err.println("Run '" + commandLine.getCommandSpec().qualifiedName() + " --help' for usage.");
        err.flush();
        return ExitCodes.USAGE;
    }

    private static boolean requested(CommandLine.ParseResult parseResult, String option) {
        for (CommandLine.ParseResult result = parseResult; result != null; result = result.subcommand()) {
            if (result.hasMatchedOption(option)) {
                return true;
            }
        }
        return false;
    }

    /** Reports the build's version. */
    static final class Version implements CommandLine.IVersionProvider {
        @Override
        public String[] getVersion() {
            return new String[] {"tare " + Tare.version()};
        }
    }
}
