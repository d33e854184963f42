package dev.tare.app;

import dev.tare.workspace.Workspace;
import java.nio.file.Path;
import java.util.List;

/** The one line that says why a run found no template and what to do about it. */
final class NoTemplates {
    /** How many of the files that look like prompts the line names. */
    private static final int NAMED = 5;

    private NoTemplates() {
    }

    /**
     * @param promptLike the root-relative files that look like prompts although no include glob
     *                   selects them, sorted
     */
    static String message(Workspace workspace, List<String> promptLike) {
        String where = workspace.starts().isEmpty() ? workspace.displayName()
                : String.join(", ", workspace.starts().stream().map(start -> relative(workspace, start)).toList());
        String globs = (workspace.config().file().isPresent() ? "the include globs of tare.yaml ("
                : "the default include globs (") + String.join(", ", workspace.config().templates().include()) + ")";
        if (!workspace.starts().isEmpty() || promptLike.isEmpty()) {
            return "no template found in " + where + ": no file matches " + globs + " or looks like a prompt"
                    + " (a template extension, a prompts folder, placeholders, role lines or chat messages),"
                    + " and no source file holds a prompt Tare recognises; name the files to measure, set"
                    + " templates.include in tare.yaml, or mark a prompt in code with a 'tare: prompt' comment";
        }
        List<String> named = promptLike.subList(0, Math.min(NAMED, promptLike.size()));
        String more = promptLike.size() > NAMED ? " and " + (promptLike.size() - NAMED) + " more" : "";
        return "no template found in " + where + ": no file matches " + globs + ", but " + String.join(", ", named)
                + more + (promptLike.size() == 1 ? " looks" : " look") + " like "
                + (promptLike.size() == 1 ? "a prompt" : "prompts")
                + "; run 'tare init' to write include globs that match them, or add globs to templates.include in tare.yaml";
    }

    private static String relative(Workspace workspace, Path start) {
        return workspace.root().relativize(start).toString().replace('\\', '/');
    }
}
