package dev.tare.lint.rules;

import dev.tare.TareException;
import dev.tare.footprint.CallSize;
import dev.tare.footprint.Footprints;
import dev.tare.footprint.Target;
import dev.tare.footprint.Traffic;
import dev.tare.lint.Example;
import dev.tare.lint.Finding;
import dev.tare.lint.LintContext;
import dev.tare.lint.Related;
import dev.tare.lint.Rule;
import dev.tare.lint.RuleDescriptor;
import dev.tare.lint.Severity;
import dev.tare.lint.TemplateView;
import dev.tare.overlap.StaticPrefix;
import dev.tare.template.Message;
import dev.tare.template.Rendering;
import dev.tare.template.Segment;
import dev.tare.template.Template;
import dev.tare.template.TemplateKind;
import dev.tare.tokenize.Tokenizer;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.OptionalDouble;

/**
 * Per-call text (a variable, or a function call's output) ahead of a long static part. Providers
 * cache a prompt's leading tokens only when they are the same on every call and at least the target's
 * {@code prefix_cache.min_tokens} long; a variable before that point means no prefix is ever cached.
 * The rule fires when the static text before the first variable is shorter than the minimum but the
 * template's static text as a whole reaches it, and says how many tokens every call would start with
 * were the per-call text moved after the static text. The leading text is measured as the scan
 * measures cached tokens ({@link StaticPrefix}: includes pasted in, a variable inside an include
 * counts where it stands), so that the two agree on where a template's per-call part starts.
 */
final class CacheOrder implements Rule {
    static final RuleDescriptor DESCRIPTOR = RuleDescriptor.builtIn("cache-order", Severity.WARNING,
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
        Optional<Rendering> samples = context.rendering(template);
        if (samples.isEmpty() || samples.get().variables().isEmpty()) {
            return List.of();
        }
        Tokenizer tokenizer = context.tokenizer(template);
        int minimum = context.prefixCacheMinTokens(template);
        List<String> leading;
        List<String> reordered;
        try {
            leading = StaticPrefix.of(samples.get());
            reordered = StaticPrefix.reordered(template, context.renderer());
        } catch (TareException e) {
            return List.of();
        }
        int prefix = tokens(tokenizer, leading);
        int total = tokens(tokenizer, reordered);
        if (prefix >= minimum || total < minimum) {
            return List.of();
        }
        List<Segment> perCall = perCallParts(template, context);
        if (perCall.isEmpty()) {
            return List.of();
        }
        Segment first = perCall.get(0);
        TemplateView text = context.text(template);
        UnsizedVariable.Location at = UnsizedVariable.locate(text, template, first);
        List<Related> related = new ArrayList<>();
        for (Segment other : perCall.subList(1, Math.min(perCall.size(), 6))) {
            UnsizedVariable.Location place = UnsizedVariable.locate(text, template, other);
            related.add(text.related(place.message(), place.start(), "more per-call text: " + source(other)));
        }
        String message = String.format(Locale.ROOT,
                "'%s' %s after only %,d leading static tokens, below the %,d-token cache minimum, and %,d static"
                        + " tokens follow; with the per-call parts (%s) moved after the static parts, every call"
                        + " would start with the same %,d tokens on %s, enough to be cached%s ('tare scan' shows the"
                        + " cache per template; planning estimate)",
                source(first), first instanceof Segment.Include ? "brings in per-call text" : "comes", prefix, minimum,
                total - prefix, perCallCount(samples.get()), total, tokenizer.name(),
                savings(template, context, leading, reordered));
        return List.of(text.finding(DESCRIPTOR, at.message(), at.start(), at.end(), message, Optional.empty(), related));
    }

    /** How many variables and function calls the rendering holds, in words: "2 variables", "1 variable and 1 call". */
    private static String perCallCount(Rendering samples) {
        long calls = samples.variables().stream().filter(occurrence -> occurrence.part() instanceof Segment.Call).count();
        long variables = samples.variables().size() - calls;
        String callWords = calls + (calls == 1 ? " call" : " calls");
        String variableWords = variables + (variables == 1 ? " variable" : " variables");
        return calls == 0 ? variableWords : variables == 0 ? callWords : variableWords + " and " + callWords;
    }

    /**
     * The template's own segments that make calls differ, in order: its variables and function calls,
     * and its includes whose pasted text holds one.
     */
    private static List<Segment> perCallParts(Template template, LintContext context) {
        List<Segment> parts = new ArrayList<>();
        for (Message message : template.messages()) {
            for (Segment segment : message.segments()) {
                if (segment instanceof Segment.PerCall || segment instanceof Segment.Include include
                        && bringsVariables(template, message, include, context)) {
                    parts.add(segment);
                }
            }
        }
        return parts;
    }

    private static boolean bringsVariables(Template template, Message message, Segment.Include include, LintContext context) {
        Template alone = new Template(template.path(), template.kind(), template.meta(),
                List.of(new Message(message.role(), message.content(), List.of(include))), template.source(),
                template.bodyStart(), template.syntax());
        try {
            return !context.renderer().renderStatic(alone).variables().isEmpty();
        } catch (TareException e) {
            return false;
        }
    }

    private static String source(Segment segment) {
        return segment instanceof Segment.PerCall part ? part.source()
                : segment instanceof Segment.Include include ? include.source() : "";
    }

    /**
     * What moving the per-call parts last would save a month on each priced target with a provider's
     * cache, at this template's own traffic (shared prefixes would only add to it): the month with
     * the prefix as written less the month with the reordered one, the same call otherwise. The
     * prefixes are the scan's, so the two agree on a template that shares its prefix with no other.
     */
    private static String savings(Template template, LintContext context, List<String> leading, List<String> reordered) {
        List<String> parts = new ArrayList<>();
        for (Target target : context.targets(template)) {
            if (target.price().isEmpty() || target.prefixCache().filter(c -> c.ttlSeconds().isPresent()).isEmpty()) {
                continue;
            }
            Traffic traffic = context.config().traffic().of(template.path(), template.meta().callsPerDay(), target);
            if (traffic.callsPerDay().isEmpty()) {
                continue;
            }
            Tokenizer tokenizer = context.tokenizer(target);
            // As the scan measures a static prefix: the tools sent with the template, the framing of
            // the leading messages, then their text.
            int head = context.sentToolTokens(template, target)
                    + (template.isChat() ? leading.size() * target.messageOverheadTokens() : 0);
            int now = head + target.scaled(tokens(tokenizer, leading));
            int later = head + target.scaled(tokens(tokenizer, reordered));
            OptionalDouble asWritten = Footprints.estimate(target, new CallSize(later, 0, 0, now), traffic).costPerMonth();
            OptionalDouble moved = Footprints.estimate(target, new CallSize(later, 0, 0, later), traffic).costPerMonth();
            double saving = asWritten.getAsDouble() - moved.getAsDouble();
            if (saving > 0) {
                parts.add(String.format(Locale.ROOT, "%s %s %,.2f", target.name(),
                        target.price().get().currency(), saving));
            }
        }
        return parts.isEmpty() ? "" : ", saving about " + String.join(", ", parts) + " a month at this template's traffic";
    }

    private static int tokens(Tokenizer tokenizer, List<String> messages) {
        int total = 0;
        for (String message : messages) {
            total += tokenizer.count(message);
        }
        return total;
    }
}
