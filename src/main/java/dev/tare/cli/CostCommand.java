package dev.tare.cli;

import dev.tare.app.CostEstimate;
import dev.tare.footprint.Sweep;
import dev.tare.report.CostReport;
import dev.tare.workspace.Workspace;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.OptionalInt;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;
import picocli.CommandLine;

/** {@code tare cost}: the footprint of one prompt size, or one template, on one target. */
@Command(name = "cost", mixinStandardHelpOptions = true, addMethodSubcommands = false,
        description = {"Estimates the footprint of one prompt on one configured target: cost per call and per month"
                + " on priced targets; prefill compute and time, decode time, weight and KV-cache memory and"
                + " concurrent requests on targets with a model and a device; with --concurrency N, decode step time,"
                + " tokens per second and time to first token with N requests served at once.",
                "Give the prompt size with --tokens, or a template FILE measured as 'tare scan' measures it.",
                "--sweep repeats the estimate across values, for example --sweep weight_bits=16,8,4 --sweep kv_bits=16,8,"
                + " to see what quantizing weights or the KV cache does on that device.",
                "All cost, time and memory figures are planning estimates, not measurements or invoices."})
final class CostCommand implements Callable<Integer> {
    enum Format { text, json }

    @Spec
    private CommandSpec spec;

    @Mixin
    private CommonOptions common;

    @Option(names = "--target", paramLabel = "NAME", required = true, description = "The configured target to estimate on.")
    private String target;

    @Option(names = "--tokens", paramLabel = "N", description = "Input tokens per call (the prompt size).")
    private Integer tokens;

    @Parameters(paramLabel = "FILE", arity = "0..1", description = "A template file to measure instead of --tokens.")
    private Path file;

    @Option(names = "--output-tokens", paramLabel = "M",
            description = "Output tokens per call. Default: the template's output_tokens, else the target's, else 0.")
    private Integer outputTokens;

    @Option(names = "--prefix-tokens", paramLabel = "P",
            description = {"The static prefix: leading input tokens every call sends alike (tools, then the text up to"
                    + " the first per-call part), on a target with a prefix_cache. Tare works out the part the cache"
                    + " holds and how often it is found there.",
                    "Default: measured from FILE; 0 with --tokens."})
    private Integer prefixTokens;

    @Option(names = "--calls-per-day", paramLabel = "N",
            description = "Calls a day, for monthly costs and the prefix cache's hit rate. Default: the target's calls_per_day.")
    private Double callsPerDay;

    /** The option this command had before prefix caching was estimated from the static prefix; kept to say so. */
    @Option(names = "--cached-tokens", paramLabel = "C", hidden = true)
    private Integer cachedTokens;

    @Option(names = "--concurrency", paramLabel = "N", description = "Requests served at once: decode step time,"
            + " tokens per second and time to first token at that load. Default: the target's concurrency, else 1.")
    private Integer concurrency;

    @Option(names = "--sweep", paramLabel = "KEY=V1,V2", description = "Sweep a setting across values (repeatable): "
            + "weight_bits, kv_bits (numbers or fp32, fp16, bf16, fp8, int8, int4, int4-g32, int4-g128, int3-g32, int2-g32),"
            + " memory_gib, usable_fraction,"
            + " peak_tflops, bandwidth_gbps, efficiency, bandwidth_efficiency, concurrency, input_tokens, output_tokens.")
    private List<String> sweeps = new ArrayList<>();

    @Option(names = "--format", paramLabel = "FORMAT", description = "Output format: ${COMPLETION-CANDIDATES}. Default: ${DEFAULT-VALUE}.")
    private Format format = Format.text;

    @Override
    public Integer call() {
        CommandLine commandLine = spec.commandLine();
        if ((tokens == null) == (file == null)) {
            throw new CommandLine.ParameterException(commandLine, "give either --tokens N or a template FILE, not "
                    + (tokens == null ? "neither" : "both"));
        }
        nonNegative(commandLine, "--tokens", tokens);
        nonNegative(commandLine, "--output-tokens", outputTokens);
        if (cachedTokens != null) {
            throw new CommandLine.ParameterException(commandLine, "--cached-tokens is gone: give --prefix-tokens P (the"
                    + " static prefix) and Tare works out the cached part from the target's prefix_cache and traffic");
        }
        nonNegative(commandLine, "--prefix-tokens", prefixTokens);
        if (callsPerDay != null && !(callsPerDay >= 0) || callsPerDay != null && callsPerDay.isInfinite()) {
            throw new CommandLine.ParameterException(commandLine, "--calls-per-day must be 0 or more (got " + callsPerDay + ")");
        }
        if (concurrency != null && concurrency < 1) {
            throw new CommandLine.ParameterException(commandLine, "--concurrency must be 1 or more (got " + concurrency + ")");
        }
        if (file != null && !Files.isRegularFile(file)) {
            throw new CommandLine.ParameterException(commandLine, file + ": no such file");
        }
        List<Sweep.Axis> axes = sweeps.stream().map(Sweep.Axis::parse).toList();
        // With --tokens there is nothing to scan: the workspace is the configuration's folder.
        List<Path> paths = file != null ? List.of(file)
                : common.configFile().map(c -> List.of(c.toAbsolutePath().getParent())).orElse(List.of());
        Workspace workspace = Workspace.open(paths, common.configFile());
        Optional<String> relative = Optional.ofNullable(file).map(f -> workspace.root()
                .relativize(f.toAbsolutePath().normalize()).toString().replace('\\', '/'));
        CostEstimate.Result result = CostEstimate.run(workspace, new CostEstimate.Request(target, optional(tokens),
                relative, optional(outputTokens), optional(prefixTokens),
                callsPerDay == null ? OptionalDouble.empty() : OptionalDouble.of(callsPerDay), axes, optional(concurrency)));
        String report = format == Format.json ? CostReport.json(result) : CostReport.text(result);
        commandLine.getOut().print(report);
        commandLine.getOut().flush();
        return ExitCodes.OK;
    }

    private static void nonNegative(CommandLine commandLine, String option, Integer value) {
        if (value != null && value < 0) {
            throw new CommandLine.ParameterException(commandLine, option + " must be 0 or more (got " + value + ")");
        }
    }

    private static OptionalInt optional(Integer value) {
        return value == null ? OptionalInt.empty() : OptionalInt.of(value);
    }
}
