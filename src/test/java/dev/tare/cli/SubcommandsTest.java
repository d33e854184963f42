package dev.tare.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.util.ArrayList;
import java.util.List;
import java.util.Set;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import picocli.CommandLine.Command;
import picocli.CommandLine;

/** The command line that builds only the subcommand being run behaves as the one that builds them all. */
class SubcommandsTest {
    private static Cli.Run run(boolean lazy, String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        PrintWriter outWriter = new PrintWriter(out, true);
        PrintWriter errWriter = new PrintWriter(err, true);
        CommandLine commandLine = lazy ? TareCommand.commandLine(outWriter, errWriter, args)
                : TareCommand.commandLine(outWriter, errWriter);
        int code = commandLine.execute(args);
        return new Cli.Run(code, out.toString(), err.toString());
    }

    @ParameterizedTest
    @ValueSource(strings = {"", "--help", "--version", "help", "help scan", "scna", "scan --help", "scan --no-such-flag",
            "count", "count --format yaml x.md", "hook", "hook --help", "hook run --help", "hook nope", "hook install --help", "help hook", "rules",
            "explain blank-lines", "explain no-such-rule", "cost --help", "check --fail-on never"})
    void printsWhatTheFullCommandLinePrints(String line) {
        String[] args = line.isEmpty() ? new String[0] : line.split(" ");
        assertEquals(run(false, args), run(true, args));
    }

    @Test
    void buildsOnlyTheSubcommandNamedFirst() {
        PrintWriter sink = new PrintWriter(new StringWriter());
        assertEquals(Set.of("count"), TareCommand.commandLine(sink, sink, "count", "a.md").getSubcommands().keySet());
        CommandLine hook = TareCommand.commandLine(sink, sink, "hook", "run");
        assertEquals(Set.of("hook"), hook.getSubcommands().keySet());
        assertEquals(Set.of("run"), hook.getSubcommands().get("hook").getSubcommands().keySet());
        assertEquals(HookCommand.SUBCOMMANDS.keySet(),
                TareCommand.commandLine(sink, sink, "hook", "--help").getSubcommands().get("hook").getSubcommands().keySet());
        assertEquals(TareCommand.SUBCOMMANDS.keySet(), TareCommand.commandLine(sink, sink, "help", "count").getSubcommands().keySet());
        assertEquals(TareCommand.SUBCOMMANDS.keySet(), TareCommand.commandLine(sink, sink, "--help").getSubcommands().keySet());
    }

    @Test
    void eachSubcommandIsListedUnderItsOwnName() {
        List<String> annotated = new ArrayList<>();
        for (Class<?> command : TareCommand.SUBCOMMANDS.values()) {
            annotated.add(command.getAnnotation(Command.class).name());
        }
        assertEquals(List.copyOf(TareCommand.SUBCOMMANDS.keySet()), annotated);
    }

    /**
     * Start-up work picocli can skip: looking for command methods (Tare has none, and a command that
     * leaves the default on makes picocli reflect over its methods on every run).
     */
    @Test
    void noCommandLooksForCommandMethods() {
        PrintWriter sink = new PrintWriter(new StringWriter());
        List<String> scanningForMethods = new ArrayList<>();
        List<CommandLine> pending = new ArrayList<>(List.of(TareCommand.commandLine(sink, sink)));
        while (!pending.isEmpty()) {
            CommandLine command = pending.remove(pending.size() - 1);
            pending.addAll(command.getSubcommands().values());
            boolean ours = command.getCommandSpec().userObject().getClass().getName().startsWith("dev.tare.");
            if (ours && command.getCommandSpec().isAddMethodSubcommands()) {
                scanningForMethods.add(command.getCommandSpec().qualifiedName());
            }
        }
        assertEquals(List.of(), scanningForMethods);
    }

    /** A mistyped command or option gets the name it most likely meant. */
    @Test
    void mistypedCommandsAndOptionsGetDidYouMean() {
        Cli.Run command = Cli.run("scna");
        assertEquals(2, command.exitCode());
        assertEquals("tare: unknown command 'scna'; did you mean 'scan'?\nRun 'tare --help' for usage.\n", command.err());
        Cli.Run option = Cli.run("scan", "--fromat", "json");
        assertEquals(2, option.exitCode());
        assertTrue(option.err().startsWith("tare: unknown option '--fromat'; did you mean '--format'?\n"), option.err());
        Cli.Run far = Cli.run("scan", "--zzz");
        assertTrue(far.err().startsWith("tare: unknown option '--zzz'\n"), far.err());
    }
}
