package dev.tare.app;

import dev.tare.TareException;
import dev.tare.config.Glob;
import dev.tare.config.TareConfig;
import dev.tare.source.SafeReader;
import dev.tare.source.SourceText;
import dev.tare.template.PartialDirectory;
import dev.tare.template.Renderer;
import dev.tare.template.RoleMarkers;
import dev.tare.template.Template;
import dev.tare.template.TemplateParser;
import dev.tare.template.code.CodePrompts;
import dev.tare.template.code.Language;
import dev.tare.workspace.FileSelection;
import dev.tare.workspace.StagedTemplates;
import dev.tare.workspace.TemplateFinder;
import dev.tare.workspace.Workspace;
import java.util.Optional;

/**
 * The one pipeline from a workspace to parsed templates, shared by every command that reads
 * templates: find the files, read each safely, parse it with the configured syntax, and render it
 * with includes resolved in the partials folder (each partial parsed once per loader). Thread-safe.
 */
public final class TemplateLoader {
    private final Workspace workspace;
    private final SafeReader reader;
    private final TemplateParser parser;
    private final PartialCache partials;
    private final Renderer renderer;

    public TemplateLoader(Workspace workspace) {
        this.workspace = workspace;
        TareConfig config = workspace.config();
        this.reader = new SafeReader(config.templates().maxFileBytes());
        this.parser = new TemplateParser(config.templates().placeholder(), config.templates().roles());
        // An included file is pasted in as text, so its role marker lines are text there.
        this.partials = new PartialCache(workspace.root(), config.templates(), reader,
                new TemplateParser(config.templates().placeholder(), RoleMarkers.OFF));
        this.renderer = new Renderer(new PartialDirectory(config.templates().partials(), partials::load));
    }

    /**
     * The template files the workspace's configuration selects, and the links it would not follow.
     *
     * @throws TareException when there is none: a scan, check or fix of nothing would pass while
     *                       checking nothing, so the message names the globs tried, the files that
     *                       look like prompts, and what to do
     */
    public FileSelection find() {
        TemplateFinder finder = finder();
        FileSelection selection = finder.find(workspace.starts());
        if (selection.paths().isEmpty()) {
            throw noTemplates();
        }
        return selection;
    }

    /**
     * The error of a run that found no template: the include globs tried, the files that look like
     * prompts, and what to do. Also for a run whose files were all source files without prompts.
     */
    public TareException noTemplates() {
        return new TareException(NoTemplates.message(workspace, finder().promptLikeFiles()));
    }

    /** The files staged for the next commit that the configuration selects, read from the git index. */
    public StagedTemplates staged() {
        return StagedTemplates.read(workspace, finder(), reader);
    }

    private TemplateFinder finder() {
        TareConfig config = workspace.config();
        return new TemplateFinder(workspace.root(), Glob.all(config.templates().allIncludes()),
                Glob.all(config.templates().exclude()));
    }

    /** Reads the file at a root-relative path, as the loader would before parsing it. */
    public SourceText read(String path) {
        return reader.read(path, workspace.root().resolve(path));
    }

    /**
     * Reads and parses the template at a root-relative path.
     *
     * @throws TareException with the reason (not prefixed with the path) when it cannot be used
     */
    public Template load(String path) {
        return parse(read(path));
    }

    /**
     * Parses already-read text (for example the staged version of a file). A source file becomes a
     * template of kind code holding the prompts written in it, none when it holds none.
     *
     * @throws TareException when a {@code tare:} comment cannot be applied, or the file cannot be read
     *                       as its language to the end, naming the line and what to write
     */
    public Template parse(SourceText text) {
        Optional<Language> language = Language.of(text.path());
        if (language.isEmpty()) {
            return parser.parse(text, workspace.config().templates().isPartial(text.path()));
        }
        CodePrompts found = CodePrompts.find(text.path(), text.text(), language.get(),
                workspace.config().templates().code().calls());
        if (!found.problems().isEmpty()) {
            throw new TareException(found.problems().get(0)
                    + (found.problems().size() > 1 ? " (and " + (found.problems().size() - 1) + " more)" : ""));
        }
        if (found.stopped().isPresent()) {
            throw new TareException(found.stopped().get());
        }
        return found.template(text.path(), text.text());
    }

    /** The renderer that resolves this workspace's includes. */
    public Renderer renderer() {
        return renderer;
    }

    /**
     * A renderer that resolves includes in {@code texts} (root-relative path to the text a file would
     * hold) before the files on disk: for rendering files as a rewrite would leave them.
     */
    public Renderer renderer(java.util.function.Function<String, Optional<Template>> texts) {
        return new Renderer(new PartialDirectory(workspace.config().templates().partials(),
                path -> texts.apply(path).or(() -> partials.load(path))));
    }

    /** The workspace this loader reads. */
    public Workspace workspace() {
        return workspace;
    }
}
