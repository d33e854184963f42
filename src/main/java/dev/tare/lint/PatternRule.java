package dev.tare.lint;

import com.google.re2j.Matcher;
import com.google.re2j.Pattern;
import dev.tare.structure.Role;
import dev.tare.template.Template;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;

/**
 * A rule declared in a rule pack: an RE2 pattern (linear-time, so no pattern can backtrack
 * catastrophically), the scope it looks in, and an optional replacement in which {@code $0} to
 * {@code $9} stand for the match and its groups and {@code $$} for a dollar sign. Matches that would
 * cut through a variable, include or tag are never reported.
 */
final class PatternRule implements Rule {
    private final RuleDescriptor descriptor;
    private final Pattern find;
    private final Scope scope;
    private final Optional<String> replace;
    private final Optional<String> message;
    /** What every match contains ({@link RequiredLiteral}); a message without it is not searched. */
    private final RequiredLiteral.Filter required;

    PatternRule(RuleDescriptor descriptor, Pattern find, Scope scope, Optional<String> replace, Optional<String> message) {
        this.descriptor = descriptor;
        this.find = find;
        this.scope = scope;
        this.replace = replace;
        this.message = message;
        this.required = RequiredLiteral.filter(find.pattern());
    }

    @Override
    public RuleDescriptor descriptor() {
        return descriptor;
    }

    @Override
    public List<Finding> check(Template template, LintContext context) {
        TemplateView text = context.text(template);
        List<Finding> findings = new ArrayList<>();
        for (MessageView message : text.messages()) {
            String content = message.content();
            if (!required.admits(content)) {
                continue;
            }
            Matcher matcher = find.matcher(content);
            int from = 0;
            while (from <= content.length() && matcher.find(from)) {
                int start = matcher.start();
                int end = matcher.end();
                from = end > start ? end : end + 1;
                if (end == start || !allowed(message, start, end)) {
                    continue;
                }
                Optional<Rewrite> rewrite = replace.flatMap(r -> text.rewrite(message,
                        List.of(new Edit(start, end, substitute(r, matcher))), context.tokenizer(template)));
                findings.add(text.finding(descriptor, message, start, end, describe(matcher.group(), rewrite, matcher),
                        rewrite, List.of()));
            }
        }
        return findings;
    }

    private boolean allowed(MessageView message, int start, int end) {
        if (descriptor.rewriteClass() == RewriteClass.SAFE) {
            // A safe pack rule edits whitespace only, and only where the structure model allows that.
            return message.allowsWhitespaceEdit(start, end);
        }
        return scope == Scope.PROSE ? !message.isProtected(start, end)
                : !message.touches(start, end, Role.PLACEHOLDER);
    }

    private String describe(String matched, Optional<Rewrite> rewrite, Matcher matcher) {
        String shown = quote(matched);
        String summary = descriptor.summary();
        String base = message.orElse(summary.endsWith(".") ? summary.substring(0, summary.length() - 1) : summary);
        if (replace.isPresent()) {
            String replacement = substitute(replace.get(), matcher);
            return base + ": " + shown + (replacement.isEmpty() ? " can go" : " -> " + quote(replacement));
        }
        return base + ": " + shown;
    }

    private static String quote(String text) {
        String oneLine = text.replace("\n", "\\n").replace("\t", "\\t");
        return "'" + (oneLine.length() > 60 ? oneLine.substring(0, 57) + "..." : oneLine) + "'";
    }

    /** The replacement with {@code $0}..{@code $9} and {@code $$} filled in from the match. */
    static String substitute(String template, Matcher matcher) {
        StringBuilder out = new StringBuilder();
        for (int i = 0; i < template.length(); i++) {
            char c = template.charAt(i);
            if (c == '$' && i + 1 < template.length()) {
                char next = template.charAt(i + 1);
                if (next == '$') {
                    out.append('$');
                    i++;
                    continue;
                }
                if (Character.isDigit(next)) {
                    int group = next - '0';
                    String value = group <= matcher.groupCount() ? matcher.group(group) : null;
                    out.append(value == null ? "" : value);
                    i++;
                    continue;
                }
            }
            out.append(c);
        }
        return out.toString();
    }
}
