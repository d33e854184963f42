package dev.tare.lint.rules;

import dev.tare.TareException;
import dev.tare.lint.Example;
import dev.tare.lint.Finding;
import dev.tare.lint.LintContext;
import dev.tare.lint.Related;
import dev.tare.lint.RewriteClass;
import dev.tare.lint.Rule;
import dev.tare.lint.RuleDescriptor;
import dev.tare.lint.Severity;
import dev.tare.lint.TemplateText;
import dev.tare.scan.Estimates;
import dev.tare.template.Message;
import dev.tare.template.Segment;
import dev.tare.template.Template;
import dev.tare.template.TemplateKind;
import dev.tare.tokenize.Tokenizer;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;

/**
 * Per-call text (a variable) ahead of a long static part. Providers cache a prompt's leading tokens
 * only when they are the same on every call and at least the target's
 * {@code prefix_cache_min_tokens} long; a variable before that point means no prefix is ever cached.
 * The rule fires when the static text before the first variable is shorter than the minimum but the
 * template's static text as a whole reaches it, and says how many tokens would be cacheable with
 * the per-call text moved after the static text.
 */
final class CacheOrder implements Rule {
    static final RuleDescriptor DESCRIPTOR = RuleDescriptor.builtIn("cache-order", Severity.WARNING, RewriteClass.NONE,
            "Per-call text (a variable) placed ahead of a long static part, so no prefix of the prompt can be cached.",
            "Prefix caches reuse the leading tokens that are identical on every call; one variable near the top"
                    + " makes every call start differently, so the whole static part is paid at the full price and"
                    + " prefilled again each time.",
            "Put the static instructions first and the per-call text (dates, names, user input) after them.",
            new Example("Today is {{ date }}.\nYou answer questions about water bills. Be brief and polite, and"
                    + " never promise a refund or a repair time.\n",
                    "You answer questions about water bills. Be brief and polite, and never promise a refund or a"
                            + " repair time.\nToday is {{ date }}.\n",
                    java.util.Map.of(Example.PREFIX_CACHE_MIN_TOKENS, 16)));

    @Override
    public RuleDescriptor descriptor() {
        return DESCRIPTOR;
    }

    @Override
    public List<Finding> check(Template template, LintContext context) {
        if (template.kind() == TemplateKind.PARTIAL) {
            return List.of();
        }
        List<Segment.Variable> variables = new ArrayList<>();
        int firstMessage = -1;
        for (int m = 0; m < template.messages().size(); m++) {
            for (Segment segment : template.messages().get(m).segments()) {
                if (segment instanceof Segment.Variable variable) {
                    variables.add(variable);
                    if (firstMessage < 0) {
                        firstMessage = m;
                    }
                }
            }
        }
        if (variables.isEmpty()) {
            return List.of();
        }
        Tokenizer tokenizer = context.tokenizer(template);
        int minimum = context.prefixCacheMinTokens(template);
        int prefix;
        int total;
        try {
            prefix = Estimates.tokens(tokenizer, context.renderer().renderStatic(before(template, firstMessage, variables.get(0))));
            total = Estimates.tokens(tokenizer, context.renderer().renderStatic(template));
        } catch (TareException e) {
            return List.of();
        }
        if (prefix >= minimum || total < minimum) {
            return List.of();
        }
        TemplateText text = context.text(template);
        UnsizedVariable.Location at = UnsizedVariable.locate(text, template, variables.get(0));
        List<Related> related = new ArrayList<>();
        for (Segment.Variable other : variables.subList(1, Math.min(variables.size(), 6))) {
            UnsizedVariable.Location place = UnsizedVariable.locate(text, template, other);
            related.add(text.related(place.message(), place.start(), "more per-call text: " + other.source()));
        }
        String message = String.format(Locale.ROOT,
                "'%s' comes after only %,d static tokens, below the %,d-token cache minimum, and %,d static tokens"
                        + " follow; with the per-call text (%d %s) moved after the static text, about %,d tokens would"
                        + " be cacheable on %s (planning estimate)",
                variables.get(0).source(), prefix, minimum, total - prefix, variables.size(),
                variables.size() == 1 ? "variable" : "variables", total, tokenizer.name());
        return List.of(text.finding(DESCRIPTOR, at.message(), at.start(), at.end(), message, Optional.empty(), related));
    }

    /** The template cut just before {@code variable}: the messages before its own, and its own up to it. */
    private static Template before(Template template, int messageIndex, Segment.Variable variable) {
        List<Message> messages = new ArrayList<>(template.messages().subList(0, messageIndex));
        Message own = template.messages().get(messageIndex);
        List<Segment> segments = new ArrayList<>();
        for (Segment segment : own.segments()) {
            if (segment == variable) {
                break;
            }
            segments.add(segment);
        }
        messages.add(new Message(own.role(), own.content(), segments));
        return new Template(template.path(), template.kind(), template.meta(), messages, template.source(),
                template.bodyStart(), template.syntax());
    }
}
