package dev.tare.cli;

import dev.tare.TareException;
import dev.tare.app.CheckResult;
import dev.tare.app.PreCommitHook;
import dev.tare.app.StagedCheck;
import dev.tare.report.CheckReport;
import dev.tare.report.FixReport;
import dev.tare.workspace.Workspace;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/**
 * {@code tare hook}: the git pre-commit hook. The hook that {@code install} writes runs
 * {@code tare hook run} through the {@code ./tare} launcher that installed it, which alone chooses
 * the JVM options; when Tare was started without the launcher ({@code java -jar tare.jar hook
 * install}), the hook runs {@code java -jar} with the same Java and jar and no extra JVM options.
 */
@Command(name = "hook", mixinStandardHelpOptions = true, addMethodSubcommands = false,
        description = "Installs or removes the git pre-commit hook that checks staged templates before each commit.")
final class HookCommand implements Runnable {
    /** The hook's subcommands by name, in the order help lists them; added by {@link TareCommand}, which builds only the one that runs. */
    static final Map<String, Class<?>> SUBCOMMANDS = subcommands();

    private static Map<String, Class<?>> subcommands() {
        Map<String, Class<?>> byName = new LinkedHashMap<>();
        byName.put("install", Install.class);
        byName.put("uninstall", Uninstall.class);
        byName.put("run", Run.class);
        return byName;
    }

    @Spec
    private CommandSpec spec;

    @Override
    public void run() {
        throw new picocli.CommandLine.ParameterException(spec.commandLine(), "name a hook command: install, uninstall or run");
    }

    /**
     * The system property in which the {@code ./tare} launcher names itself. The installed hook runs
     * Tare through that launcher, so that the JVM options stay the launcher's choice alone.
     */
    static final String LAUNCHER = "tare.launcher";

    /**
     * The shell command the installed pre-commit hook runs (followed by {@code hook run}): the
     * launcher that started this run, when {@link #LAUNCHER} names one, so the hook gets the JVM
     * options the launcher chooses for it. Without a launcher (Tare started with plain
     * {@code java -jar}), the hook runs this Java with this jar and no extra JVM options; from a
     * class folder rather than a jar (a development run), with this class path.
     */
    static String selfCommand() {
        String location;
        try {
            location = Path.of(HookCommand.class.getProtectionDomain().getCodeSource().getLocation().toURI()).toString();
        } catch (java.net.URISyntaxException e) {
            throw new IllegalStateException("the running jar's location is not a path", e);
        }
        return command(Optional.ofNullable(System.getProperty(LAUNCHER)).filter(name -> !name.isEmpty()).map(Path::of),
                Path.of(System.getProperty("java.home"), "bin", "java"), location, System.getProperty("java.class.path"));
    }

    /**
     * The hook's command: {@code launcher} when there is one and it exists; otherwise {@code java}
     * with the jar at {@code location}, or with {@code classPath} when {@code location} is no jar.
     */
    static String command(Optional<Path> launcher, Path java, String location, String classPath) {
        Optional<Path> present = launcher.map(Path::toAbsolutePath).filter(Files::isRegularFile);
        if (present.isPresent()) {
            return quote(present.get().toString());
        }
        if (location.endsWith(".jar")) {
            return quote(java.toString()) + " -jar " + quote(location);
        }
        return quote(java.toString()) + " -cp " + quote(classPath) + " " + Main.class.getName();
    }

    private static String quote(String word) {
        return "'" + word.replace("'", "'\\''") + "'";
    }

    @Command(name = "install", mixinStandardHelpOptions = true, addMethodSubcommands = false,
            description = "Adds a pre-commit hook to the git repository of the current folder. A hook Tare did not write is left"
                    + " alone unless --chain (keep it and run it first) or --force (replace it, keeping a backup copy).")
    static final class Install implements Callable<Integer> {
        @Spec
        private CommandSpec spec;

        @Parameters(paramLabel = "FOLDER", arity = "0..1", description = "A folder of the repository. Default: the current folder.")
        private Path folder = Path.of("");

        @Option(names = "--chain", description = "Keep an existing hook and run it before Tare's.")
        private boolean chain;

        @Option(names = "--force", description = "Replace an existing hook Tare did not write (a copy is kept as pre-commit.tare-backup).")
        private boolean force;

        @Override
        public Integer call() throws IOException {
            if (chain && force) {
                throw new TareException("--chain and --force exclude each other: keep the existing hook, or replace it");
            }
            PreCommitHook hook = PreCommitHook.of(folder.toAbsolutePath());
            PreCommitHook.Installed outcome = hook.install(selfCommand(), chain, force);
            String what = switch (outcome) {
                case NEW -> "Installed";
                case UPDATED -> "Updated";
                case CHAINED -> "Installed (the existing hook now runs first, from pre-commit.before-tare)";
                case REPLACED -> "Replaced the existing hook (a copy is in pre-commit.tare-backup); installed";
            };
            spec.commandLine().getOut().println(what + " " + hook.file() + ".");
            return ExitCodes.OK;
        }
    }

    @Command(name = "uninstall", mixinStandardHelpOptions = true, addMethodSubcommands = false,
            description = "Removes Tare's pre-commit hook (only Tare's), putting back a hook it chained.")
    static final class Uninstall implements Callable<Integer> {
        @Spec
        private CommandSpec spec;

        @Parameters(paramLabel = "FOLDER", arity = "0..1", description = "A folder of the repository. Default: the current folder.")
        private Path folder = Path.of("");

        @Override
        public Integer call() throws IOException {
            PreCommitHook hook = PreCommitHook.of(folder.toAbsolutePath());
            String what = switch (hook.uninstall()) {
                case REMOVED -> "Removed " + hook.file() + ".";
                case RESTORED_CHAINED -> "Removed Tare's hook; the hook it chained is back at " + hook.file() + ".";
                case NOTHING_INSTALLED -> "No pre-commit hook is installed at " + hook.file() + ".";
            };
            spec.commandLine().getOut().println(what);
            return ExitCodes.OK;
        }
    }

    @Command(name = "run", mixinStandardHelpOptions = true, addMethodSubcommands = false,
            description = "What the installed hook runs before each commit: with hook.fix set in tare.yaml, applies safe"
                    + " rewrites to fully staged templates and stages them; then checks the staged templates (their staged"
                    + " content) and stops the commit when a finding is at or above error.")
    static final class Run implements Callable<Integer> {
        @Spec
        private CommandSpec spec;

        @picocli.CommandLine.Mixin
        private CommonOptions common;

        @Override
        public Integer call() {
            StagedCheck.Outcome outcome = StagedCheck.run(Workspace.open(List.of(), common.configFile()));
            outcome.fixed().filter(fixed -> !fixed.files().isEmpty() || !fixed.skipped().isEmpty())
                    .ifPresent(fixed -> spec.commandLine().getOut().print(FixReport.text(fixed, false)));
            CheckResult result = outcome.result();
            if (!result.findings().isEmpty()) {
                spec.commandLine().getOut().print(CheckReport.text(result));
                spec.commandLine().getOut().flush();
            }
            if (result.failed()) {
                spec.commandLine().getErr().println("tare: commit stopped by the pre-commit hook: fix the errors above"
                        + " (or record deliberate growth with 'tare baseline'), then commit again");
                spec.commandLine().getErr().flush();
                return ExitCodes.FINDINGS;
            }
            return ExitCodes.OK;
        }
    }
}
