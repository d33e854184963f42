package dev.tare.app;

import dev.tare.TareException;
import dev.tare.template.Template;
import dev.tare.template.TemplateKind;
import java.nio.file.Files;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.concurrent.ConcurrentHashMap;

/**
 * The tools sent with templates: the tool files they name in their front matter ({@code tools:}),
 * each read and parsed once per run however many templates send it, and the definitions they write
 * there in place; safe to share between threads.
 */
final class ToolFiles {
    private final TemplateLoader loader;
    private final Map<String, Template> parsed = new ConcurrentHashMap<>();

    ToolFiles(TemplateLoader loader) {
        this.loader = loader;
    }

    /**
     * The tool files sent with {@code template}, in the order its front matter names them, then the
     * tools it defines in place as one more ({@link Template#inlineToolFile()}).
     *
     * @throws TareException naming the file, when one is missing, unreadable or holds no list of tools
     */
    List<Template> sentWith(Template template) {
        List<Template> tools = new ArrayList<>();
        for (String path : template.meta().tools()) {
            tools.add(parsed.computeIfAbsent(path, this::load));
        }
        template.inlineToolFile().ifPresent(tools::add);
        return tools;
    }

    /** The tool file at a root-relative path, or empty when it is missing, unreadable or no tool file. */
    Optional<Template> find(String path) {
        try {
            return Optional.of(parsed.computeIfAbsent(path, this::load));
        } catch (TareException e) {
            return Optional.empty();
        }
    }

    private Template load(String path) {
        if (!Files.isRegularFile(loader.workspace().root().resolve(path))) {
            throw new TareException("front matter names tool file '" + path + "', which does not exist"
                    + " (tool paths are relative to the folder of tare.yaml)");
        }
        Template tool;
        try {
            tool = loader.load(path);
        } catch (TareException e) {
            throw new TareException("tool file " + path + ": " + e.getMessage(), e);
        }
        if (tool.kind() != TemplateKind.TOOLS) {
            throw new TareException("front matter names '" + path + "' as a tool file, but it holds no list of tools");
        }
        return tool;
    }
}
