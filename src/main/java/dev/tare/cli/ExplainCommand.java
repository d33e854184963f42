package dev.tare.cli;

import dev.tare.lint.RuleCatalog;
import dev.tare.report.RuleReport;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/** {@code tare explain RULE}: what a rule flags, why it costs, an example and what to write instead. */
@Command(name = "explain", mixinStandardHelpOptions = true, addMethodSubcommands = false,
        description = {"Explains one rule in four parts: what it flags, why it costs, a worked example (the same"
                + " one 'tare rules test' runs) and what to write instead."})
final class ExplainCommand implements Callable<Integer> {
    @Spec
    private CommandSpec spec;

    @Mixin
    private CommonOptions common;

    @Parameters(paramLabel = "RULE", description = "The rule's id, as 'tare rules' lists it.")
    private String rule;

    @Override
    public Integer call() {
        RuleCatalog catalog = RulesCommand.catalog(common);
        spec.commandLine().getOut().print(RuleReport.explainText(catalog.rule(rule).descriptor()));
        spec.commandLine().getOut().flush();
        return ExitCodes.OK;
    }
}
