package dev.tare.cli;

import dev.tare.Tare;
import dev.tare.TareException;
import dev.tare.config.Suggestion;
import dev.tare.tokenize.TokenizerRegistry;
import java.io.PrintWriter;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import picocli.CommandLine.Command;
import picocli.CommandLine;

/** The top-level {@code tare} command, which only holds the subcommands. */
@Command(name = "tare",
        mixinStandardHelpOptions = true,
        addMethodSubcommands = false,
        versionProvider = TareCommand.Version.class,
        description = "Measures and shrinks the token footprint of the prompt templates in a repository.",
        footer = {"", "Exit codes: 0 ok (scan: it measured something), 1 findings or a budget or baseline breach (check) or a file"
                + " left unfixed (fix), 2 usage, configuration or input error, or no template found,"
                + " 3 internal error (add --debug for the stack trace)."})
public final class TareCommand implements Runnable {
    /**
     * The subcommands by name, in the order help lists them. They are not in the annotation because
     * picocli would then build every one of them (reflecting over all their options) on each run;
     * {@link #commandLine(PrintWriter, PrintWriter, String...)} builds only the one that runs.
     */
    static final Map<String, Class<?>> SUBCOMMANDS = subcommands();

    @CommandLine.Spec
    private CommandLine.Model.CommandSpec spec;

    @Override
    public void run() {
        throw new CommandLine.ParameterException(spec.commandLine(), "name a command, for example: tare scan .");
    }

    private static Map<String, Class<?>> subcommands() {
        Map<String, Class<?>> byName = new LinkedHashMap<>();
        byName.put("scan", ScanCommand.class);
        byName.put("check", CheckCommand.class);
        byName.put("fix", FixCommand.class);
        byName.put("count", CountCommand.class);
        byName.put("cost", CostCommand.class);
        byName.put("targets", TargetsCommand.class);
        byName.put("rules", RulesCommand.class);
        byName.put("explain", ExplainCommand.class);
        byName.put("baseline", BaselineCommand.class);
        byName.put("calibrate", CalibrateCommand.class);
        byName.put("hook", HookCommand.class);
        byName.put("init", InitCommand.class);
        byName.put("help", CommandLine.HelpCommand.class);
        return byName;
    }

    /** A configured command line with every subcommand, writing to {@code out} and {@code err}. */
    public static CommandLine commandLine(PrintWriter out, PrintWriter err) {
        return configure(new CommandLine(new TareCommand()), SUBCOMMANDS.keySet().toArray(String[]::new), new String[0], out, err);
    }

    /**
     * A configured command line for running {@code args}: when they start with a subcommand's name,
     * only that subcommand is built, which is most of picocli's start-up work; otherwise (help, a
     * version request, a misspelt name) every subcommand is, so the messages are the same as ever.
     */
    public static CommandLine commandLine(PrintWriter out, PrintWriter err, String... args) {
        boolean one = args.length > 0 && SUBCOMMANDS.containsKey(args[0]) && !args[0].equals("help");
        String[] names = one ? new String[] {args[0]} : SUBCOMMANDS.keySet().toArray(String[]::new);
        return configure(new CommandLine(new TareCommand()), names, one ? Arrays.copyOfRange(args, 1, args.length) : new String[0],
                out, err);
    }

    private static CommandLine configure(CommandLine commandLine, String[] subcommands, String[] rest, PrintWriter out,
                                         PrintWriter err) {
        for (String name : subcommands) {
            commandLine.addSubcommand(name, SUBCOMMANDS.get(name));
        }
        CommandLine hook = commandLine.getSubcommands().get("hook");
        if (hook != null) {
            // The hook's own subcommands, built the same way: only the one named, when one is.
            boolean one = rest.length > 0 && HookCommand.SUBCOMMANDS.containsKey(rest[0]);
            for (String name : one ? List.of(rest[0]) : HookCommand.SUBCOMMANDS.keySet()) {
                hook.addSubcommand(name, HookCommand.SUBCOMMANDS.get(name));
            }
        }
        commandLine.setOut(out);
        commandLine.setErr(err);
        commandLine.setCaseInsensitiveEnumValuesAllowed(true);
        // count reads its own @LIST files (see CountCommand); no other command takes lists.
        commandLine.setExpandAtFiles(false);
        commandLine.setExecutionExceptionHandler(TareCommand::handleExecutionException);
        commandLine.setExecutionStrategy(parseResult -> {
            long started = System.nanoTime();
            double loadedBefore = TokenizerRegistry.loadMillis();
            int code = new CommandLine.RunLast().execute(parseResult);
            if (requested(parseResult, "--timings")) {
                Timings.print(commandLine.getErr(), started, TokenizerRegistry.loadMillis() - loadedBefore);
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
        err.println("tare: " + (ex instanceof CommandLine.UnmatchedArgumentException unmatched
                && !unmatched.getUnmatched().isEmpty() ? unmatched(commandLine, unmatched.getUnmatched().get(0))
                : ex.getMessage()));
        err.println("Run '" + commandLine.getCommandSpec().qualifiedName() + " --help' for usage.");
        err.flush();
        return ExitCodes.USAGE;
    }

    /** An argument no command or option takes, with the name it most likely meant. */
    private static String unmatched(CommandLine commandLine, String argument) {
        boolean option = argument.startsWith("-");
        String typed = option && argument.contains("=") ? argument.substring(0, argument.indexOf('=')) : argument;
        java.util.Collection<String> names = option
                ? commandLine.getCommandSpec().options().stream().flatMap(o -> Arrays.stream(o.names())).toList()
                : commandLine.getSubcommands().keySet();
        String what = option ? "unknown option '" + typed + "'"
                : commandLine.getSubcommands().isEmpty() ? "unexpected argument '" + argument + "'"
                : "unknown command '" + argument + "'";
        return what + Suggestion.didYouMean(typed, names);
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
