package dev.tare.app;

import dev.tare.TareException;
import dev.tare.footprint.CallSize;
import dev.tare.footprint.Coverage;
import dev.tare.footprint.Footprint;
import dev.tare.footprint.Footprints;
import dev.tare.footprint.Sweep;
import dev.tare.footprint.Target;
import dev.tare.tokenize.TokenizerRegistry;
import dev.tare.workspace.Workspace;
import java.util.List;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.OptionalInt;

/**
 * The footprint of one prompt on one target, given as a token count or as a template file (measured
 * as {@code scan} measures it: estimated tokens plus framing), optionally swept across settings.
 */
public final class CostEstimate {
    private CostEstimate() {
    }

    /**
     * What is asked.
     *
     * @param target       the target's name
     * @param inputTokens  the prompt size, when given as a number
     * @param file         the template, when given as a file (inside the workspace)
     * @param outputTokens output tokens per call, overriding the template's and the target's
     * @param prefixTokens the static prefix (P), overriding the file's; none for a bare token count
     * @param callsPerDay  calls a day, overriding the target's
     * @param sweep        settings to sweep; empty for one footprint
     * @param concurrency  requests served at once, overriding the target's
     */
    public record Request(String target, OptionalInt inputTokens, Optional<String> file, OptionalInt outputTokens,
                          OptionalInt prefixTokens, OptionalDouble callsPerDay, List<Sweep.Axis> sweep,
                          OptionalInt concurrency) {
        public Request {
            sweep = List.copyOf(sweep);
        }

        /** A request at the target's own traffic and concurrency. */
        public Request(String target, OptionalInt inputTokens, Optional<String> file, OptionalInt outputTokens,
                       OptionalInt prefixTokens, List<Sweep.Axis> sweep) {
            this(target, inputTokens, file, outputTokens, prefixTokens, OptionalDouble.empty(), sweep, OptionalInt.empty());
        }
    }

    /**
     * What was found.
     *
     * @param target    the target's configuration
     * @param file      the template measured, as a root-relative path, when one was given
     * @param call      the token counts the footprint was estimated from
     * @param footprint the footprint under the target's own settings
     * @param coverage  what the target can and cannot estimate
     * @param sweep     the swept axes, empty when none
     * @param rows      one footprint per combination of the swept values
     */
    public record Result(Target target, Optional<String> file, CallSize call, Footprint footprint,
                         Coverage coverage, List<Sweep.Axis> sweep, List<Sweep.Row> rows) {
        public Result {
            sweep = List.copyOf(sweep);
            rows = List.copyOf(rows);
        }
    }

    /**
     * Estimates the request on the workspace's configuration.
     *
     * @throws TareException for an unknown target, an unusable file or an impossible token count
     */
    public static Result run(Workspace workspace, Request request) {
        Target configured = workspace.config().target(request.target());
        Target target = request.concurrency().isPresent()
                ? configured.withConcurrency(request.concurrency().getAsInt()) : configured;
        CallSize measured = request.file().isPresent()
                ? measure(workspace, target, request.file().get())
                : CallSize.of(request.inputTokens().orElseThrow(() -> new IllegalArgumentException("no prompt size")),
                target.outputTokens().orElse(0));
        OptionalDouble calls = request.callsPerDay().isPresent() || request.file().isEmpty() ? request.callsPerDay()
                : workspace.config().traffic().of(request.file().get(),
                new TemplateLoader(workspace).load(request.file().get()).meta().callsPerDay(), target).callsPerDay();
        if (calls.isPresent()) {
            target = target.withCallsPerDay(calls.getAsDouble());
        }
        int prefix = measured.staticPrefixTokens();
        if (request.prefixTokens().isPresent()) {
            prefix = request.prefixTokens().getAsInt();
            if (target.prefixCache().isEmpty()) {
                throw new TareException("target '" + target.name() + "' has no prefix cache; give it prefix_cache:"
                        + " {min_tokens: N} (a provider's) or {block_tokens: N} (a server's) to estimate caching");
            }
            if (prefix > measured.inputTokens()) {
                throw new TareException("--prefix-tokens " + prefix + " is more than the " + measured.inputTokens()
                        + " input tokens; the static prefix is part of the input");
            }
        }
        CallSize call = new CallSize(measured.inputTokens(), measured.framingTokens(),
                request.outputTokens().orElse(measured.outputTokens()), prefix);
        List<Sweep.Row> rows = request.sweep().isEmpty() ? List.of() : Sweep.run(target, call, request.sweep());
        return new Result(target, request.file(), call, Footprints.estimate(target, call), Coverage.of(target),
                request.sweep(), rows);
    }

    private static CallSize measure(Workspace workspace, Target target, String file) {
        ScanResult scan = new TemplateScan(workspace, new TokenizerRegistry())
                .run(new ScanOptions(List.of(target.name()), Optional.empty()));
        if (!scan.skipped().isEmpty()) {
            throw new TareException(scan.skipped().get(0).path() + ": " + scan.skipped().get(0).reason());
        }
        if (scan.templates().isEmpty()) {
            throw new TareException(file + ": no template found there; give a template file");
        }
        ScannedTemplate template = scan.templates().get(0);
        Footprint footprint = template.targets().get(target.name());
        if (footprint == null) {
            throw new TareException(template.key() + " names another target in its front matter, not '"
                    + target.name() + "'");
        }
        return new CallSize(footprint.inputTokens(), footprint.framingTokens(), footprint.outputTokens(),
                footprint.caching().map(Footprint.Caching::staticPrefixTokens).orElse(0));
    }
}
