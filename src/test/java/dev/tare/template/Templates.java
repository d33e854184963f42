package dev.tare.template;

import dev.tare.source.SourceText;
import java.nio.file.Path;
import java.util.Map;
import java.util.Optional;

/** Builds templates from strings for tests. */
final class Templates {
    private Templates() {
    }

    static Template parse(PlaceholderSyntax syntax, String path, String text) {
        return new TemplateParser(syntax).parse(new SourceText(path, Path.of(path), text, false, text.length()), false);
    }

    static Template text(PlaceholderSyntax syntax, String text) {
        return parse(syntax, "t.md", text);
    }

    /** A renderer whose partials are the given path-to-text map, parsed with {@code syntax}. */
    static Renderer renderer(PlaceholderSyntax syntax, Map<String, String> partials) {
        return new Renderer(new PartialDirectory("partials", path -> Optional.ofNullable(partials.get(path))
                .map(text -> parse(syntax, path, text))));
    }

    static String staticText(PlaceholderSyntax syntax, String text) {
        return String.join("|", renderer(syntax, Map.of()).renderStatic(text(syntax, text)).messages());
    }
}
