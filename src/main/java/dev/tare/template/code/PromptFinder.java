package dev.tare.template.code;

import dev.tare.template.LineIndex;
import dev.tare.template.code.Places.Kind;
import dev.tare.template.code.Places.Place;
import dev.tare.template.code.ValueReader.Value;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;

/**
 * Finds the prompts among a file's string literals: for each literal it builds the value
 * ({@link ValueReader}), reads its place ({@link Places}), reads the {@code tare:} comments above it,
 * and asks {@link PromptRules} whether it is a prompt; it then records the prompt with its parts and
 * the map of its characters back to the file.
 */
final class PromptFinder {
    private final String source;

    private final Language language;

    private final List<String> calls;

    private final CodeTokens t;

    private final LineIndex lines;

    private final List<String> problems = new ArrayList<>();

    private final Map<Integer, Integer> commentEndingOn = new HashMap<>();

    private final int[] commentStartLine;

    private final List<List<TareComments.Line>> commentLines = new ArrayList<>();

    private final boolean[] commentUsed;

    /** The {@code tare:} comments above each line asked for, read once. */
    private final Map<Integer, TareComments> commentsByLine = new HashMap<>();
    private final ValueReader values;
    private final Places places;
    private final PromptRules rules;

    PromptFinder(String source, Language language, List<String> calls, CodeTokens tokens, LineIndex lines) {
        this.source = source;
        this.language = language;
        this.calls = calls;
        this.t = tokens;
        this.lines = lines;
        this.commentStartLine = new int[tokens.comments.size()];
        this.commentUsed = new boolean[tokens.comments.size()];
        this.values = new ValueReader(tokens, language);
        this.places = new Places(tokens, language);
        this.rules = new PromptRules(calls);
    }

    List<String> problems() {
        return List.copyOf(new LinkedHashSet<>(problems));
    }

    List<CodePrompt> find() {
        indexComments();
        List<CodePrompt> found = new ArrayList<>();
        int i = 0;
        while (i < t.size()) {
            if (t.kind(i) != CodeTokens.STRING) {
                i++;
                continue;
            }
            Value value = values.value(i);
            consider(value, i).ifPresent(found::add);
            i = Math.max(i, value.last) + 1;
        }
        for (int c = 0; c < commentLines.size(); c++) {
            if (!commentUsed[c] && !commentLines.get(c).isEmpty()) {
                problems.add("line " + commentLines.get(c).get(0).line() + ": this tare: comment stands above no string"
                        + " literal; put it on the line just above the literal or the name it is assigned to");
            }
        }
        return found;
    }

    private int lineAt(int viewOffset) {
        return lines.line(t.view.from(Math.min(viewOffset, t.view.length())));
    }

    /** Whether {@code text} holds {@code tare:} in any case, as a {@code tare:} comment line begins. */
    private static boolean mentionsTare(String text) {
        for (int colon = text.indexOf(':'); colon >= 0; colon = text.indexOf(':', colon + 1)) {
            if (colon >= 4 && text.regionMatches(true, colon - 4, "tare", 0, 4)) {
                return true;
            }
        }
        return false;
    }

    /** Notes each comment that stands alone on its lines, by the line it ends on, and its {@code tare:} lines. */
    private void indexComments() {
        if (t.comments.stream().noneMatch(comment -> mentionsTare(comment.text()))) {
            // No tare: comment: nothing to find above any literal, and most files have none.
            return;
        }
        java.util.BitSet code = new java.util.BitSet();
        for (int k = 0; k < t.size(); k++) {
            if (t.kind(k) != CodeTokens.NEWLINE) {
                code.set(lineAt(t.start(k)), lineAt(Math.max(t.start(k), t.end(k) - 1)) + 1);
            }
        }
        for (int c = 0; c < t.comments.size(); c++) {
            CodeTokens.Comment comment = t.comments.get(c);
            int first = lineAt(comment.start());
            int last = lineAt(Math.max(comment.start(), comment.end() - 1));
            commentStartLine[c] = first;
            commentLines.add(TareComments.lines(comment.text(), first));
            int codeOnLines = code.nextSetBit(first);
            if (codeOnLines < 0 || codeOnLines > last) {
                commentEndingOn.put(last, c);
            }
        }
    }

    /** The {@code tare:} comments in the blocks of comment lines just above each of {@code anchorLines}. */
    private TareComments commentsAbove(Set<Integer> anchorLines) {
        List<TareComments> blocks = new ArrayList<>();
        for (int line : anchorLines) {
            TareComments block = commentsByLine.computeIfAbsent(line, this::readBlockAbove);
            if (block.any() && !blocks.contains(block)) {
                blocks.add(block);
            }
        }
        return blocks.size() == 1 ? blocks.get(0) : TareComments.merged(blocks);
    }

    private TareComments readBlockAbove(int line) {
        List<Integer> block = new ArrayList<>();
        Set<Integer> seen = new java.util.HashSet<>();
        Integer c = commentEndingOn.get(line - 1);
        while (c != null && seen.add(c)) {
            block.add(0, c);
            c = commentEndingOn.get(commentStartLine[c] - 1);
        }
        TareComments read = new TareComments();
        for (int comment : block) {
            commentUsed[comment] = true;
            for (TareComments.Line tareLine : commentLines.get(comment)) {
                read.read(tareLine);
            }
        }
        return read;
    }

    private Optional<CodePrompt> consider(Value value, int firstLiteral) {
        Place place = places.place(value.first);
        List<Place> outer = place.kind() == Kind.KEY || place.kind() == Kind.ELEMENT ? places.outer(place) : List.of();
        Set<Integer> anchors = new LinkedHashSet<>();
        anchors.add(lineAt(t.start(value.first)));
        anchors.add(lineAt(t.start(firstLiteral)));
        if (place.anchor() >= 0) {
            anchors.add(lineAt(t.start(place.anchor())));
        }
        for (Place up : outer) {
            if (up.anchor() >= 0) {
                anchors.add(lineAt(t.start(up.anchor())));
            }
        }
        TareComments comments = commentsAbove(anchors);
        problems.addAll(comments.problems());
        if (comments.ignore()) {
            return Optional.empty();
        }
        boolean prompt = comments.prompt() || rules.saysPrompt(place, outer) && rules.excluded(value, place).isEmpty();
        if (!prompt) {
            if (comments.hasSettings()) {
                problems.add("line " + lineAt(t.start(firstLiteral)) + ": the tare: settings above this string literal"
                        + " apply to nothing, since Tare does not take it for a prompt; add 'prompt' to the comment to"
                        + " measure it");
            }
            return Optional.empty();
        }
        return Optional.of(prompt(value, place, outer, comments));
    }

    private CodePrompt prompt(Value value, Place place, List<Place> outer, TareComments comments) {
        DecodedText text = value.text;
        int firstLine = lineAt(t.start(value.ownFirst));
        String name = comments.settings().getOrDefault("name", PromptRules.name(place, outer, firstLine));
        String role = comments.settings().getOrDefault("role", places.role(place));
        List<CodePart> parts = new ArrayList<>();
        int k = 0;
        while (k < text.length()) {
            int end = k + 1;
            int variable = text.variableAt(k);
            while (end < text.length() && text.variableAt(end) == variable
                    && (variable >= 0 || text.pieceAt(end) == text.pieceAt(k))) {
                end++;
            }
            int sourceStart = text.from(k);
            int sourceEnd = Math.max(sourceStart, text.to(end - 1));
            Optional<String> name0 = variable >= 0 ? Optional.of(text.variable(variable).name()) : Optional.empty();
            parts.add(new CodePart(text.text(k, end), name0, k, end, sourceStart, sourceEnd, lines.line(sourceStart),
                    lines.column(sourceStart)));
            k = end;
        }
        int start = t.view.from(t.start(value.ownFirst));
        int end = t.view.to(t.end(value.ownLast) - 1);
        return new CodePrompt(name, role.isEmpty() ? Optional.empty() : Optional.of(role), lines.line(start),
                lines.column(start), start, end, text.text(), parts, new ValueMap(text), comments.meta(),
                comments.settings());
    }
}
