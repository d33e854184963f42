package dev.tare.report;

import dev.tare.app.FileCounts.FileTokens;
import java.util.List;

/** Renders whole-file token counts. */
public final class CountReport {
    private CountReport() {
    }

    /** One line per file, then a total when there is more than one. */
    public static String text(String tokenizer, List<FileTokens> entries) {
        TextTable table = new TextTable(List.of("TOKENS", "CHARS", "PATH"), true, true, false);
        long total = 0;
        long chars = 0;
        for (FileTokens entry : entries) {
            table.row(List.of(TextTable.number(entry.tokens()), TextTable.number(entry.chars()), entry.path()));
            total += entry.tokens();
            chars += entry.chars();
        }
        if (entries.size() > 1) {
            table.rule();
            table.row(List.of(TextTable.number(total), TextTable.number(chars), "total"));
        }
        return "Tokens on " + tokenizer + "\n\n" + table.render();
    }

    /** The JSON document of the design contract, written as it is made: it may name many thousand files. */
    public static String json(String tokenizer, List<FileTokens> entries) {
        return Json.stream(out -> {
            out.writeStringField("tokenizer", tokenizer);
            out.writeArrayFieldStart("files");
            long total = 0;
            for (FileTokens entry : entries) {
                out.writeStartObject();
                out.writeStringField("path", entry.path());
                out.writeNumberField("tokens", entry.tokens());
                out.writeNumberField("chars", entry.chars());
                out.writeEndObject();
                total += entry.tokens();
            }
            out.writeEndArray();
            out.writeObjectFieldStart("total");
            out.writeNumberField("tokens", total);
            out.writeEndObject();
        });
    }
}
