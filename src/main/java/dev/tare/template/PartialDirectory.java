package dev.tare.template;

import dev.tare.TareException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.function.Function;

/**
 * Resolves include names the way Tare documents them: first in the partials folder, then beside the
 * including template; the name as written, then with each of {@link #EXTENSIONS}. A name that leads
 * outside the scanned root (an absolute path, or {@code ../} past the top) is refused.
 */
public final class PartialDirectory implements IncludeResolver {
    /** Extensions tried, in order, after the name as written. */
    public static final List<String> EXTENSIONS = List.of(".md", ".txt", ".prompt", ".j2", ".jinja", ".mustache", ".hbs");

    private final String partials;
    private final Function<String, Optional<Template>> loader;

    /**
     * @param partials the partials folder relative to the root, with {@code /}; empty for none
     * @param loader   loads the template at a root-relative path, empty when no such file exists;
     *                 throws {@link TareException} when it exists but cannot be used
     */
    public PartialDirectory(String partials, Function<String, Optional<Template>> loader) {
        this.partials = partials;
        this.loader = loader;
    }

    @Override
    public Template resolve(Segment.Include include, Template from) {
        String name = include.name().strip();
        if (name.startsWith("/") || name.startsWith("\\") || name.matches("^[A-Za-z]:.*")) {
            throw refusal(include, "is an absolute path");
        }
        List<String> tried = new ArrayList<>();
        for (String folder : folders(from)) {
            Path candidate = Path.of(folder.isEmpty() ? "." : folder).resolve(name).normalize();
            String base = candidate.toString().replace('\\', '/');
            if (base.equals("..") || base.startsWith("../")) {
                throw refusal(include, "leads outside the scanned root");
            }
            for (String extension : withBare()) {
                String path = base + extension;
                tried.add(path);
                Optional<Template> found = loader.apply(path);
                if (found.isPresent()) {
                    return found.get();
                }
            }
        }
        throw new TareException("line " + include.span().line() + ": include '" + include.name()
                + "' names no file (tried " + String.join(", ", tried.subList(0, Math.min(tried.size(), 4)))
                + (tried.size() > 4 ? ", ..." : "") + ")"
                + (partials.isEmpty() ? "; set templates.partials in tare.yaml" : ""));
    }

    private List<String> folders(Template from) {
        int slash = from.path().lastIndexOf('/');
        String beside = slash < 0 ? "" : from.path().substring(0, slash);
        List<String> folders = new ArrayList<>();
        if (!partials.isEmpty()) {
            folders.add(partials);
        }
        if (!folders.contains(beside)) {
            folders.add(beside);
        }
        return folders;
    }

    private static List<String> withBare() {
        List<String> all = new ArrayList<>();
        all.add("");
        all.addAll(EXTENSIONS);
        return all;
    }

    private static TareException refusal(Segment.Include include, String why) {
        return new TareException("line " + include.span().line() + ": include '" + include.name() + "' " + why
                + "; includes must name a file under the scanned root");
    }
}
