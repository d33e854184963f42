package dev.tare.source;

import java.io.IOException;
import java.nio.file.AccessDeniedException;
import java.nio.file.DirectoryNotEmptyException;
import java.nio.file.FileAlreadyExistsException;
import java.nio.file.FileSystemException;
import java.nio.file.NoSuchFileException;
import java.nio.file.NotDirectoryException;

/** What went wrong with a file, in words rather than the name of a Java exception. */
public final class IoProblem {
    private IoProblem() {
    }

    /** A short phrase such as "permission denied" or "no such file", with the system's reason when it gives one. */
    public static String describe(IOException e) {
        String what;
        if (e instanceof NoSuchFileException) {
            what = "no such file or folder";
        } else if (e instanceof AccessDeniedException) {
            what = "permission denied";
        } else if (e instanceof FileAlreadyExistsException) {
            what = "a file is in the way";
        } else if (e instanceof NotDirectoryException) {
            what = "a file stands where a folder is needed";
        } else if (e instanceof DirectoryNotEmptyException) {
            what = "the folder is not empty";
        } else if (e instanceof FileSystemException fs && fs.getReason() != null) {
            what = fs.getReason();
        } else {
            what = e.getMessage() == null ? "an input or output error" : e.getMessage();
        }
        if (e instanceof FileSystemException fs && fs.getReason() != null && !what.equals(fs.getReason())) {
            what += ": " + fs.getReason();
        }
        return what;
    }
}
