package dev.tare.app;

import dev.tare.cache.TemplateCache;
import dev.tare.lint.Edit;
import dev.tare.lint.Finding;
import dev.tare.lint.Related;
import dev.tare.lint.Rewrite;
import dev.tare.lint.RewriteClass;
import dev.tare.lint.Severity;
import dev.tare.lint.Suppressions;
import java.io.DataInputStream;
import java.io.DataOutputStream;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;

/**
 * How a check keeps a {@link CheckedFile} in its {@link TemplateCache}. Strings are written with
 * their length as an int, not as modified UTF-8, which stops at 64 KiB: a rewrite's replacement can
 * be a whole block. A finding's path is written only when it is not the file's own. Rule ids and
 * messages are read as one copy each (one cache, read on one thread): many findings say the same.
 */
final class CheckedFileCodec implements TemplateCache.Codec<CheckedFile> {
    private static final Severity[] SEVERITIES = Severity.values();
    private static final RewriteClass[] CLASSES = RewriteClass.values();

    private final Map<String, String> copies = new java.util.HashMap<>();

    @Override
    public void write(DataOutputStream out, CheckedFile checked) throws IOException {
        String own = checked.findings().isEmpty() ? "" : checked.findings().get(0).path();
        string(out, own);
        out.writeInt(checked.findings().size());
        for (Finding finding : checked.findings()) {
            out.writeBoolean(finding.path().equals(own));
            if (!finding.path().equals(own)) {
                string(out, finding.path());
            }
            out.writeInt(finding.line());
            out.writeInt(finding.column());
            out.writeInt(finding.endLine());
            out.writeInt(finding.endColumn());
            string(out, finding.rule());
            out.writeByte(finding.severity().ordinal());
            string(out, finding.message());
            out.writeByte(finding.rewriteClass().ordinal());
            out.writeBoolean(finding.rewrite().isPresent());
            if (finding.rewrite().isPresent()) {
                Rewrite rewrite = finding.rewrite().get();
                out.writeInt(rewrite.savingTokens());
                out.writeInt(rewrite.edits().size());
                for (Edit edit : rewrite.edits()) {
                    out.writeInt(edit.start());
                    out.writeInt(edit.end());
                    string(out, edit.replacement());
                }
            }
            out.writeInt(finding.related().size());
            for (Related related : finding.related()) {
                string(out, related.path());
                out.writeInt(related.line());
                out.writeInt(related.column());
                string(out, related.message());
            }
        }
        out.writeBoolean(checked.suppressions().isPresent());
        if (checked.suppressions().isPresent()) {
            Suppressions suppressions = checked.suppressions().get();
            out.writeInt(suppressions.directives().size());
            for (Suppressions.Directive directive : suppressions.directives()) {
                out.writeInt(directive.offset());
                strings(out, directive.ids());
            }
            strings(out, List.copyOf(suppressions.fileWide()));
            out.writeInt(suppressions.byLine().size());
            for (Map.Entry<Integer, Set<String>> line : suppressions.byLine().entrySet()) {
                out.writeInt(line.getKey());
                strings(out, List.copyOf(line.getValue()));
            }
        }
        out.writeBoolean(checked.hash().isPresent());
        if (checked.hash().isPresent()) {
            out.writeInt(checked.hash().get());
        }
    }

    @Override
    public CheckedFile read(DataInputStream in, String path) throws IOException {
        String own = string(in);
        int count = in.readInt();
        List<Finding> findings = new ArrayList<>(count);
        for (int i = 0; i < count; i++) {
            String at = in.readBoolean() ? own : string(in);
            int line = in.readInt();
            int column = in.readInt();
            int endLine = in.readInt();
            int endColumn = in.readInt();
            String rule = once(string(in));
            Severity severity = SEVERITIES[in.readByte()];
            String message = once(string(in));
            RewriteClass rewriteClass = CLASSES[in.readByte()];
            Optional<Rewrite> rewrite = Optional.empty();
            if (in.readBoolean()) {
                int saving = in.readInt();
                int editCount = in.readInt();
                List<Edit> edits = new ArrayList<>(editCount);
                for (int e = 0; e < editCount; e++) {
                    edits.add(new Edit(in.readInt(), in.readInt(), string(in)));
                }
                rewrite = Optional.of(new Rewrite(edits, saving));
            }
            int relatedCount = in.readInt();
            List<Related> related = new ArrayList<>(relatedCount);
            for (int r = 0; r < relatedCount; r++) {
                related.add(new Related(string(in), in.readInt(), in.readInt(), string(in)));
            }
            findings.add(new Finding(at, line, column, endLine, endColumn, rule, severity, message, rewriteClass,
                    rewrite, related));
        }
        Optional<Suppressions> suppressions = Optional.empty();
        if (in.readBoolean()) {
            int directiveCount = in.readInt();
            List<Suppressions.Directive> directives = new ArrayList<>(directiveCount);
            for (int d = 0; d < directiveCount; d++) {
                directives.add(new Suppressions.Directive(in.readInt(), strings(in)));
            }
            Set<String> fileWide = new HashSet<>(strings(in));
            int lines = in.readInt();
            Map<Integer, Set<String>> byLine = new LinkedHashMap<>();
            for (int l = 0; l < lines; l++) {
                byLine.put(in.readInt(), new HashSet<>(strings(in)));
            }
            suppressions = Optional.of(Suppressions.restored(directives, fileWide, byLine));
        }
        Optional<Integer> hash = in.readBoolean() ? Optional.of(in.readInt()) : Optional.empty();
        return new CheckedFile(findings, suppressions, hash);
    }

    private String once(String text) {
        return copies.computeIfAbsent(text, t -> t);
    }

    private static void string(DataOutputStream out, String text) throws IOException {
        byte[] bytes = text.getBytes(StandardCharsets.UTF_8);
        out.writeInt(bytes.length);
        out.write(bytes);
    }

    private static String string(DataInputStream in) throws IOException {
        byte[] bytes = new byte[in.readInt()];
        in.readFully(bytes);
        return new String(bytes, StandardCharsets.UTF_8);
    }

    private static void strings(DataOutputStream out, List<String> texts) throws IOException {
        out.writeInt(texts.size());
        for (String text : texts) {
            string(out, text);
        }
    }

    private static List<String> strings(DataInputStream in) throws IOException {
        int count = in.readInt();
        List<String> texts = new ArrayList<>(count);
        for (int i = 0; i < count; i++) {
            texts.add(string(in));
        }
        return texts;
    }
}
