package dev.tare.lint.rules;

import com.fasterxml.jackson.databind.JsonNode;
import dev.tare.TareException;
import dev.tare.footprint.Estimates;
import dev.tare.footprint.Framing;
import dev.tare.footprint.Target;
import dev.tare.lint.Example;
import dev.tare.lint.Finding;
import dev.tare.lint.LintContext;
import dev.tare.lint.Rule;
import dev.tare.lint.RuleDescriptor;
import dev.tare.lint.Severity;
import dev.tare.lint.TemplateView;
import dev.tare.source.YamlDocument;
import dev.tare.template.Rendering;
import dev.tare.template.Template;
import dev.tare.tokenize.Tokenizer;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.OptionalInt;

/**
 * A template whose call (estimated input, framing and expected output tokens) is longer than the
 * context of the model it runs on: a target's model context limit ({@code max_position_embeddings}
 * of its config.json, or {@code context_limit}), or a {@code context_limit} in the template's front
 * matter, counted on its primary tokenizer.
 */
final class ContextLimit implements Rule {
    static final RuleDescriptor DESCRIPTOR = RuleDescriptor.builtIn("context-limit", Severity.WARNING,
            "A template whose input plus output tokens exceed the model's context.",
            "A call longer than the context is cut or refused: the model never sees the end of the prompt, or"
                    + " the request fails, on every call.",
            "Shorten the template or its largest variables, lower output_tokens, or run it on a model with a"
                    + " longer context.",
            Example.of("---\ncontext_limit: 12\noutput_tokens: 4\n---\nYou answer billing questions for the water"
                    + " utility, politely, briefly and in plain words.\n",
                    "---\ncontext_limit: 12\noutput_tokens: 4\n---\nAnswer billing questions.\n"));

    private static final String KEY = "context_limit";

    @Override
    public RuleDescriptor descriptor() {
        return DESCRIPTOR;
    }

    @Override
    public List<Finding> check(Template template, LintContext context) {
        Optional<Rendering> rendering = context.rendering(template);
        if (rendering.isEmpty()) {
            return List.of();
        }
        List<String> over = new ArrayList<>();
        int output = template.meta().outputTokens().orElse(0);
        for (Target target : context.targets(template)) {
            OptionalInt limit = target.model().map(m -> m.contextLimit()).orElse(OptionalInt.empty());
            if (limit.isPresent()) {
                int input = Estimates.estimatedTokens(target, context.tokenizer(target), rendering.get())
                        + Framing.tokens(target, template.isChat(), template.messages().size());
                int out = template.meta().outputTokens().orElse(target.outputTokens().orElse(0));
                describe(input, out, limit.getAsInt(), "target " + target.name()).ifPresent(over::add);
            }
        }
        OptionalInt stated = stated(template);
        if (stated.isPresent()) {
            Tokenizer tokenizer = context.tokenizer(template);
            int input = Estimates.estimatedTokens(tokenizer, rendering.get());
            describe(input, output, stated.getAsInt(), "front matter, on " + tokenizer.name()).ifPresent(over::add);
        }
        if (over.isEmpty()) {
            return List.of();
        }
        TemplateView text = context.text(template);
        String message = String.join("; ", over) + "; the call would be cut or refused (token counts are planning"
                + " estimates)";
        OptionalInt line = stated.isPresent() ? text.metaLine(KEY) : OptionalInt.empty();
        if (line.isPresent()) {
            int start = text.lineStart(line.getAsInt());
            int end = Math.min(template.source().length(), start + KEY.length());
            return List.of(text.findingInSource(DESCRIPTOR, start, end, message));
        }
        return List.of(text.finding(DESCRIPTOR, text.messages().get(0), 0, 0, message, Optional.empty(), List.of()));
    }

    private static Optional<String> describe(int input, int output, int limit, String where) {
        long total = (long) input + output;
        if (total <= limit) {
            return Optional.empty();
        }
        return Optional.of(String.format(Locale.ROOT, "estimated %,d input + %,d output = %,d tokens exceed the"
                + " context of %,d tokens (%s) by %,d", input, output, total, limit, where, total - limit));
    }

    /** The {@code context_limit} a template's front matter (or chat file) states, when it states one. */
    private static OptionalInt stated(Template template) {
        String source = template.source();
        if (!source.contains(KEY)) {
            return OptionalInt.empty();
        }
        JsonNode root;
        try {
            if (template.isDocument()) {
                root = template.path().toLowerCase(Locale.ROOT).endsWith(".json") ? YamlDocument.parseJson(source).root()
                        : YamlDocument.parseYaml(source).root();
            } else {
                String head = source.substring(0, template.bodyStart());
                if (!head.startsWith("---")) {
                    return OptionalInt.empty();
                }
                int open = head.indexOf('\n');
                int close = head.lastIndexOf("\n---");
                if (open < 0 || close <= open) {
                    return OptionalInt.empty();
                }
                root = YamlDocument.parseYaml(head.substring(open + 1, close + 1)).root();
            }
        } catch (TareException e) {
            // An unreadable front matter is the template parser's finding to make, not this rule's.
            return OptionalInt.empty();
        }
        JsonNode value = root == null ? null : root.get(KEY);
        if (value == null || !value.canConvertToInt() || !value.isIntegralNumber() || value.asInt() < 1) {
            return OptionalInt.empty();
        }
        return OptionalInt.of(value.asInt());
    }
}
