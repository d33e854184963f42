package dev.tare.structure;

import java.util.ArrayList;
import java.util.List;
import org.commonmark.ext.gfm.tables.TableBlock;
import org.commonmark.ext.gfm.tables.TablesExtension;
import org.commonmark.node.BlockQuote;
import org.commonmark.node.Code;
import org.commonmark.node.FencedCodeBlock;
import org.commonmark.node.Heading;
import org.commonmark.node.HtmlBlock;
import org.commonmark.node.IndentedCodeBlock;
import org.commonmark.node.ListItem;
import org.commonmark.node.Node;
import org.commonmark.node.SourceSpan;
import org.commonmark.node.Text;
import org.commonmark.parser.IncludeSourceSpans;
import org.commonmark.parser.Parser;

/**
 * The Markdown blocks of a text, read by a CommonMark parser with GitHub tables and source
 * positions: a role per line, the code spans, the fenced blocks and the headings. Front matter is
 * never part of the text here: the template parser has split it off already.
 */
final class MarkdownBlocks {
    /** Built once: a parser holds no state between documents. */
    private static final Parser PARSER = Parser.builder().extensions(List.of(TablesExtension.create()))
            .includeSourceSpans(IncludeSourceSpans.BLOCKS_AND_INLINES).build();

    /** A heading: its line, level and plain text. */
    record HeadingLine(int line, int level, String text) {
    }

    final Role[] roles;
    final List<int[]> codeSpans = new ArrayList<>();
    final List<Fence> fences = new ArrayList<>();
    final List<HeadingLine> headings = new ArrayList<>();
    private final LineSpans lines;

    /** Reads {@code text} (whose lines are {@code lines}); lines no block claims are blank or prose. */
    MarkdownBlocks(String text, LineSpans lines) {
        this.lines = lines;
        this.roles = new Role[lines.count()];
        visitChildren(PARSER.parse(text), Role.PROSE);
        for (int i = 0; i < roles.length; i++) {
            if (roles[i] == null) {
                roles[i] = lines.isBlank(i) ? Role.BLANK : Role.PROSE;
            }
        }
    }

    private void visitChildren(Node parent, Role context) {
        for (Node child = parent.getFirstChild(); child != null; child = child.getNext()) {
            visit(child, context);
        }
    }

    private void visit(Node node, Role context) {
        if (node instanceof BlockQuote) {
            visitChildren(node, Role.QUOTE);
        } else if (node instanceof ListItem) {
            visitChildren(node, context == Role.QUOTE ? Role.QUOTE : Role.LIST_ITEM);
        } else if (node instanceof FencedCodeBlock fenced) {
            markThrough(node, Role.FENCED_CODE);
            fence(fenced);
        } else if (node instanceof IndentedCodeBlock) {
            markThrough(node, Role.INDENTED_CODE);
        } else if (node instanceof HtmlBlock) {
            markThrough(node, Role.HTML);
        } else if (node instanceof TableBlock) {
            mark(node, Role.TABLE_ROW);
        } else if (node instanceof Heading heading) {
            mark(node, Role.HEADING);
            if (!node.getSourceSpans().isEmpty()) {
                headings.add(new HeadingLine(lineOf(node.getSourceSpans().get(0)), heading.getLevel(), plainText(node)));
            }
            codeSpans(node);
        } else if (node instanceof org.commonmark.node.Block && node.getFirstChild() instanceof org.commonmark.node.Block) {
            visitChildren(node, context);
        } else {
            mark(node, context);
            codeSpans(node);
        }
    }

    /** Gives every line a span of {@code node} touches the role, unless a block claimed it first. */
    private void mark(Node node, Role role) {
        for (SourceSpan span : node.getSourceSpans()) {
            int line = lineOf(span);
            if (roles[line] == null) {
                roles[line] = role;
            }
        }
    }

    /** Gives the role to every line from the node's first to its last, blank lines inside included (they have no span). */
    private void markThrough(Node node, Role role) {
        List<SourceSpan> spans = node.getSourceSpans();
        if (spans.isEmpty()) {
            return;
        }
        for (int line = lineOf(spans.get(0)); line <= lineOf(spans.get(spans.size() - 1)); line++) {
            if (roles[line] == null) {
                roles[line] = role;
            }
        }
    }

    private int lineOf(SourceSpan span) {
        return lines.lineOf(span.getInputIndex());
    }

    private void codeSpans(Node node) {
        for (Node child = node.getFirstChild(); child != null; child = child.getNext()) {
            if (child instanceof Code) {
                for (SourceSpan span : child.getSourceSpans()) {
                    codeSpans.add(new int[] {span.getInputIndex(), span.getInputIndex() + span.getLength()});
                }
            } else {
                codeSpans(child);
            }
        }
    }

    private void fence(FencedCodeBlock block) {
        List<SourceSpan> spans = block.getSourceSpans();
        if (spans.isEmpty()) {
            return;
        }
        int first = lineOf(spans.get(0));
        int last = lineOf(spans.get(spans.size() - 1));
        boolean closed = block.getClosingFenceLength() != null && last > first;
        int start = lines.start(first);
        int bodyStart = lines.next(first);
        int end = closed ? lines.next(last) : lines.next(last);
        int bodyEnd = closed ? lines.start(last) : end;
        String info = block.getInfo() == null ? "" : block.getInfo().strip();
        fences.add(new Fence(start, end, Math.min(bodyStart, end), Math.max(Math.min(bodyStart, end), bodyEnd), info, closed));
    }

    private static String plainText(Node node) {
        StringBuilder out = new StringBuilder();
        for (Node child = node.getFirstChild(); child != null; child = child.getNext()) {
            if (child instanceof Text t) {
                out.append(t.getLiteral());
            } else if (child instanceof Code c) {
                out.append(c.getLiteral());
            } else {
                out.append(plainText(child));
            }
        }
        return out.toString();
    }
}
