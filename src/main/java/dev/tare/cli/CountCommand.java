package dev.tare.cli;

import dev.tare.TareException;
import dev.tare.app.FileCounts;
import dev.tare.report.CountReport;
import dev.tare.tokenize.Tokenizer;
import dev.tare.tokenize.TokenizerRegistry;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;
import picocli.CommandLine;

/** {@code tare count}: raw token counts of whole files. */
@Command(name = "count", mixinStandardHelpOptions = true, addMethodSubcommands = false,
        description = {"Counts the tokens of whole files exactly as the tokenizer sees them: no template parsing,"
                + " front matter included, a leading byte-order mark left out, special-token strings counted as text.",
                "A file that cannot be read is reported and the others are still counted; the exit code is then 2."})
final class CountCommand implements Callable<Integer> {
    enum Format { text, json }

    @Spec
    private CommandSpec spec;

    @Mixin
    private CommonOptions common;

    @Parameters(paramLabel = "FILE", arity = "1..*", description = "Files to count; - reads standard input;"
            + " @LIST counts every file LIST names, one path per line.")
    private List<String> files = new ArrayList<>();

    @Option(names = "--tokenizer", paramLabel = "NAME|PATH",
            description = "A built-in encoding (o200k_base, cl100k_base, p50k_base, r50k_base) or a tokenizer.json path. Default: " + TokenizerRegistry.DEFAULT + ".")
    private String tokenizer = TokenizerRegistry.DEFAULT;

    @Option(names = "--format", paramLabel = "FORMAT", description = "Output format: ${COMPLETION-CANDIDATES}. Default: ${DEFAULT-VALUE}.")
    private Format format = Format.text;

    @Override
    public Integer call() {
        Tokenizer counter = new TokenizerRegistry().get(tokenizer, Path.of("."));
        List<String> named;
        try {
            named = FileCounts.named(files);
        } catch (TareException e) {
            throw new CommandLine.ParameterException(spec.commandLine(), e.getMessage());
        }
        FileCounts.Tally tally = FileCounts.count(named, counter);
        PrintWriter err = spec.commandLine().getErr();
        tally.errors().forEach(error -> err.println("tare: " + error));
        String report = format == Format.json ? CountReport.json(counter.name(), tally.files())
                : CountReport.text(counter.name(), tally.files());
        spec.commandLine().getOut().print(report);
        spec.commandLine().getOut().flush();
        err.flush();
        return tally.errors().isEmpty() ? ExitCodes.OK : ExitCodes.USAGE;
    }
}
