package dev.tare.app;

import dev.tare.source.IoProblem;
import dev.tare.rewrite.FileFix;
import dev.tare.source.FileBytes;
import dev.tare.source.SourceText;
import dev.tare.workspace.FileSystemOps;
import dev.tare.workspace.SafeFileWriter;
import java.io.IOException;
import java.nio.file.Path;

/**
 * Writes verified rewrites through {@link SafeFileWriter}: each file is fully rewritten or left as it
 * was. A file that changed since it was read, a file this process may not write and a failed write
 * are reported on the file's fix and leave the file untouched; a written file keeps its permissions.
 */
final class FixWriter {
    private final FileSystemOps files;

    FixWriter(FileSystemOps files) {
        this.files = files;
    }

    /** The fix after writing it to the file {@code original} was read from. */
    FileFix write(FileFix fix, SourceText original) {
        if (fix.outcome() != FileFix.Outcome.PLANNED) {
            return fix;
        }
        try {
            Path target = target(original.file());
            if (!files.isWritable(target)) {
                return fix.with(FileFix.Outcome.NOT_WRITTEN, "it is read-only for you, so it was left as it is;"
                        + " make it writable to fix it, or apply the diff by hand");
            }
            SafeFileWriter.Outcome outcome = new SafeFileWriter(files).replace(target,
                    FileBytes.encode(original.text(), original.hadBom()), FileBytes.encode(fix.after(), original.hadBom()));
            return switch (outcome) {
                case WRITTEN, UNCHANGED -> fix.with(FileFix.Outcome.WRITTEN, "");
                case CHANGED_MEANWHILE -> fix.with(FileFix.Outcome.CHANGED_MEANWHILE,
                        "it changed on disk after it was read, so it was left as it is; run the fix again");
            };
        } catch (IOException e) {
            return fix.with(FileFix.Outcome.NOT_WRITTEN, "writing it failed (" + IoProblem.describe(e)
                    + "); the file is as it was");
        }
    }

    /**
     * The fix after creating its new file at {@code file}, all at once, with the permissions of the
     * file {@code like} (a template it was made from); a file that is there already (or appears
     * meanwhile) is never replaced.
     */
    FileFix create(FileFix fix, Path file, Path like) {
        if (fix.outcome() != FileFix.Outcome.PLANNED) {
            return fix;
        }
        try {
            if (java.nio.file.Files.exists(file, java.nio.file.LinkOption.NOFOLLOW_LINKS)) {
                return fix.with(FileFix.Outcome.CHANGED_MEANWHILE, "a file stands at this path already, so the new"
                        + " partial was not written; run the fix again");
            }
            files.createFolders(file.toAbsolutePath().getParent());
            SafeFileWriter.Outcome outcome = new SafeFileWriter(files).create(file, FileBytes.encode(fix.after(), false),
                    files.permissions(like));
            return outcome == SafeFileWriter.Outcome.CHANGED_MEANWHILE
                    ? fix.with(FileFix.Outcome.CHANGED_MEANWHILE, "a file appeared at this path meanwhile, so the new"
                    + " partial was not written; run the fix again")
                    : fix.with(FileFix.Outcome.WRITTEN, "");
        } catch (IOException e) {
            return fix.with(FileFix.Outcome.NOT_WRITTEN, "creating it failed (" + IoProblem.describe(e)
                    + "); no file was left there");
        }
    }

    /** The file a path names, through symbolic links, so that a link stays a link. */
    private static Path target(Path file) throws IOException {
        return file.toRealPath();
    }
}
