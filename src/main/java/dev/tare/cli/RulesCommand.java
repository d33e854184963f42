package dev.tare.cli;

import dev.tare.app.RulePacks;
import dev.tare.lint.ExampleRunner;
import dev.tare.lint.RuleCatalog;
import dev.tare.report.RuleReport;
import dev.tare.workspace.Workspace;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/** {@code tare rules}: lists every rule; {@code tare rules test} runs every rule's examples. */
@Command(name = "rules", mixinStandardHelpOptions = true, addMethodSubcommands = false,
        description = {"Lists every rule: the built-in ones, the packs shipped with Tare and the packs named in"
                + " rules.packs of tare.yaml, with each rule's rewrite class, severity in force and summary."},
        subcommands = RulesCommand.Test.class)
final class RulesCommand implements Callable<Integer> {
    enum Format { text, json }

    @Spec
    private CommandSpec spec;

    @Mixin
    private CommonOptions common;

    @Option(names = "--format", paramLabel = "FORMAT", description = "Output format: ${COMPLETION-CANDIDATES}. Default: ${DEFAULT-VALUE}.")
    private Format format = Format.text;

    @Override
    public Integer call() {
        RuleCatalog catalog = catalog(common);
        spec.commandLine().getOut().print(format == Format.json ? RuleReport.listJson(catalog) : RuleReport.list(catalog));
        spec.commandLine().getOut().flush();
        return ExitCodes.OK;
    }

    /** The rules of the repository in the current folder, or of the one {@code --config} names. */
    static RuleCatalog catalog(CommonOptions common) {
        List<Path> start = common.configFile().map(f -> List.of(f.toAbsolutePath().getParent())).orElse(List.of());
        return RulePacks.catalog(Workspace.open(start, common.configFile()).config());
    }

    /** {@code tare rules test}: runs every rule's worked examples and reports the ones that fail. */
    @Command(name = "test", mixinStandardHelpOptions = true, addMethodSubcommands = false,
            description = {"Runs the worked examples of every rule (rule packs and built-in rules): each rule must"
                    + " flag its 'before' text, must not flag its 'after' text, and its rewrites must turn one into"
                    + " the other exactly. Exits 1 when an example fails."})
    static final class Test implements Callable<Integer> {
        @Spec
        private CommandSpec spec;

        @Mixin
        private CommonOptions common;

        @Override
        public Integer call() {
            RuleCatalog catalog = catalog(common);
            List<ExampleRunner.Outcome> outcomes = ExampleRunner.runAll(catalog);
            spec.commandLine().getOut().print(RuleReport.testResults(outcomes));
            spec.commandLine().getOut().flush();
            return outcomes.stream().allMatch(ExampleRunner.Outcome::passed) ? ExitCodes.OK : ExitCodes.FINDINGS;
        }
    }
}
